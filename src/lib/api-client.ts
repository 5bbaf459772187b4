import type { ApiErrorBody, ApiErrorDetail } from '@/shared/schemas/api-error';

/** An API answer that was not 2xx, carrying the server's stable code and its field or row details. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: ApiErrorDetail[];

  constructor(status: number, code: string, message: string, details: ApiErrorDetail[] = []) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

function isDetail(v: unknown): v is ApiErrorDetail {
  return (
    isRecord(v) &&
    typeof v.path === 'string' &&
    typeof v.message === 'string' &&
    (v.line === undefined || Number.isSafeInteger(v.line)) &&
    (v.column === undefined || typeof v.column === 'string')
  );
}

/**
 * Whether a body is the server's error shape (the same rules as `apiErrorSchema`). Checked by hand so the entry
 * chunk does not carry zod: every screen loads this module, and zod comes with the forms that need it.
 */
export function isApiErrorBody(body: unknown): body is ApiErrorBody {
  if (!isRecord(body) || !isRecord(body.error)) return false;
  const { code, message, details } = body.error;
  return (
    typeof code === 'string' &&
    typeof message === 'string' &&
    (details === undefined || (Array.isArray(details) && details.every(isDetail)))
  );
}

/** Builds an ApiError from a status and whatever body came back, even when it is not our error shape. */
export function toApiError(status: number, body: unknown): ApiError {
  if (isApiErrorBody(body)) {
    const { code, message, details } = body.error;
    return new ApiError(status, code, message, details);
  }
  if (status === 0) return new ApiError(0, 'NETWORK_ERROR', 'The server could not be reached. Check the connection.');
  return new ApiError(status, `HTTP_${status}`, `The server answered ${status}.`);
}

async function readBody(response: Response): Promise<unknown> {
  if (response.status === 204) return undefined;
  const text = await response.text();
  if (!text) return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return text;
  }
}

type RequestOptions = Omit<RequestInit, 'body'> & { body?: unknown };

/** How long a write whose answer was lost keeps its key, so that sending it again is answered, not redone. */
const LOST_ANSWER_KEEP_MS = 10 * 60_000;
const writeKeys = new Map<string, string>();

function newKey(): string {
  // getRandomValues works on plain http too (randomUUID needs a secure context).
  return Array.from(crypto.getRandomValues(new Uint8Array(16)), (b) => b.toString(16).padStart(2, '0')).join('');
}

/**
 * The Idempotency-Key of a write: the same write (method, path, body) sent again while the first is under way, or
 * after its answer was lost on the network, carries the same key, so the server does it once and answers both.
 */
function idempotencyKeyFor(identity: string): { key: string; settle: (answered: boolean) => void } {
  const key = writeKeys.get(identity) ?? newKey();
  writeKeys.set(identity, key);
  return {
    key,
    settle: (answered) => {
      if (answered) writeKeys.delete(identity);
      else setTimeout(() => writeKeys.get(identity) === key && writeKeys.delete(identity), LOST_ANSWER_KEEP_MS);
    },
  };
}

/** Same-origin JSON request with the session cookie; throws ApiError on any non-2xx answer. */
export async function apiRequest<T>(path: string, { body, headers, ...init }: RequestOptions = {}): Promise<T> {
  const json = body === undefined ? undefined : JSON.stringify(body);
  const method = (init.method ?? 'GET').toUpperCase();
  const write =
    method === 'GET' || method === 'HEAD' ? undefined : idempotencyKeyFor(`${method} ${path}\n${json ?? ''}`);
  let response: Response;
  try {
    response = await fetch(path, {
      ...init,
      credentials: 'include',
      headers: {
        Accept: 'application/json',
        ...(json === undefined ? {} : { 'Content-Type': 'application/json' }),
        ...(write ? { 'Idempotency-Key': write.key } : {}),
        ...headers,
      },
      body: json,
    });
  } catch {
    write?.settle(false);
    throw toApiError(0, undefined);
  }
  write?.settle(true);
  const payload = await readBody(response);
  if (!response.ok) throw toApiError(response.status, payload);
  return payload as T;
}

export const api = {
  get: <T>(path: string, init?: RequestOptions) => apiRequest<T>(path, { ...init, method: 'GET' }),
  post: <T>(path: string, body?: unknown) => apiRequest<T>(path, { method: 'POST', body }),
  patch: <T>(path: string, body?: unknown) => apiRequest<T>(path, { method: 'PATCH', body }),
  put: <T>(path: string, body?: unknown) => apiRequest<T>(path, { method: 'PUT', body }),
  delete: <T = void>(path: string) => apiRequest<T>(path, { method: 'DELETE' }),
};

export function isApiError(error: unknown, status?: number): error is ApiError {
  return error instanceof ApiError && (status === undefined || error.status === status);
}

/** A sentence for people: the server's message, or a generic one for unexpected failures. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof Error) return error.message;
  return 'Something went wrong.';
}
