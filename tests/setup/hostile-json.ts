import { getTableName, is, sql } from 'drizzle-orm';
import { PgTable } from 'drizzle-orm/pg-core';
import { expect } from 'vitest';
import { apiErrorSchema } from '../../src/shared/schemas/api-error';
import type { Db } from '../../server/db/client';
import * as schema from '../../server/db/schema';

/** A path into a JSON value: object keys and array indexes. */
export type JsonPath = (string | number)[];

const RAW = '\u0001raw\u0001';
const RAW_KEY = '\u0001key\u0001';

function cloneAt(
  template: unknown,
  path: JsonPath,
  set: (parent: Record<string | number, unknown>, key: string | number) => void,
): unknown {
  const copy = structuredClone(template);
  if (path.length === 0) return RAW;
  let node = copy as Record<string | number, unknown>;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  set(node, path.at(-1)!);
  return copy;
}

/** The template as JSON text with the value at `path` replaced by raw JSON text (which may be invalid on purpose). */
export function withRawValue(template: unknown, path: JsonPath, raw: string): string {
  const marked = cloneAt(template, path, (parent, key) => (parent[key] = RAW));
  return JSON.stringify(marked).replace(JSON.stringify(RAW), () => raw);
}

/** The template as JSON text with a raw member (`"key": value`) added to the object at `path`. */
export function withRawMember(template: unknown, path: JsonPath, member: string): string {
  const copy = structuredClone(template) as Record<string, unknown>;
  let node = copy;
  for (const key of path) node = node[key] as Record<string, unknown>;
  node[RAW_KEY] = 0;
  return JSON.stringify(copy).replace(`${JSON.stringify(RAW_KEY)}:0`, () => member);
}

/** Paths to every value inside a JSON value (leaves and containers), the root excluded. */
export function valuePaths(value: unknown, prefix: JsonPath = []): JsonPath[] {
  if (value === null || typeof value !== 'object') return [];
  const entries = Array.isArray(value) ? value.map((v, i) => [i, v] as const) : Object.entries(value);
  return entries.flatMap(([k, v]) => [[...prefix, k], ...valuePaths(v, [...prefix, k])]);
}

/** Paths to every object inside a JSON value, the root included. */
export function objectPaths(value: unknown, prefix: JsonPath = []): JsonPath[] {
  if (value === null || typeof value !== 'object') return [];
  const own = Array.isArray(value) ? [] : [prefix];
  const entries = Array.isArray(value) ? value.map((v, i) => [i, v] as const) : Object.entries(value);
  return [...own, ...entries.flatMap(([k, v]) => objectPaths(v, [...prefix, k]))];
}

/** Paths to every array inside a JSON value. */
export function arrayPaths(value: unknown): JsonPath[] {
  return valuePaths(value).filter((p) =>
    Array.isArray(p.reduce<unknown>((v, k) => (v as Record<string | number, unknown>)[k], value)),
  );
}

/**
 * Boundary numbers as raw JSON text. RFC 8259 section 6: NaN and Infinity are not JSON numbers (sent here as
 * strings, and bare among the malformed texts); a number beyond IEEE 754 double range (1e309) is valid JSON text that
 * JSON.parse reads as Infinity; -0, the largest doubles, and an integer beyond 2^53 where JSON.parse rounds.
 */
export const BOUNDARY_NUMBERS = [
  '"NaN"',
  '"Infinity"',
  '1e309',
  '-1e309',
  '-0',
  '1e308',
  '-1e308',
  String(Number.MAX_SAFE_INTEGER + 2),
];
/** More edges and wrong types, sampled by fast-check: the smallest double, underflow to 0, numbers as strings. */
export const MORE_NUMBERS = [
  '"-Infinity"',
  '-9007199254740993',
  '5e-324',
  '1e-400',
  '0.1',
  '2.5e-16',
  '"12"',
  '[]',
  '{}',
  'null',
  'true',
];

/** Malformed JSON text (RFC 8259 section 2 and 6): each must be refused by the parser. */
export const MALFORMED_JSON = [
  '{',
  '{"a":}',
  "{'a':1}",
  'NaN',
  '{"a":NaN}',
  '{"a":Infinity}',
  '{"a":1,}',
  '[1,]',
  '{"a":1}x',
  '{"a":01}',
  '{"a":"\\x41"}',
  '{"a":"\u0001"}',
  '"just a string"',
  '42',
  'null',
];

/**
 * Hostile strings as raw JSON text, each tried at every text field: lone surrogates (not Unicode scalar values, RFC
 * 8259 section 8.2), NUL, 10,000 characters, and a date PostgreSQL's date type cannot hold (it has no year 0).
 */
export const HOSTILE_STRINGS = [
  '"\\ud800"',
  '"a\\udc00b"',
  '"a\\u0000b"',
  JSON.stringify('x'.repeat(10_000)),
  '"0000-01-01"',
];
/** More, sampled by fast-check: RTL marks, other controls, astral and combining characters, markup, SQL, a path, dates. */
export const MORE_STRINGS = [
  '"\\u202eexe.fdp"',
  '"\\u200fA-1"',
  '"\\udfff\\ud800"',
  '"\\u0000"',
  '"\\u001b[31m"',
  JSON.stringify('\u{1F6A7}'.repeat(2_500)),
  JSON.stringify('e\u0301'.repeat(5_000)),
  '""',
  '"   "',
  '"<script>alert(1)</script>"',
  '"\' OR 1=1 --"',
  '"../../etc/passwd"',
  '"0001-01-01"',
  '"9999-12-31"',
  '"2024-02-29"',
  '"2026-02-29"',
  '"2026-13-01"',
  '"+002026-10-01"',
];

/** Prototype-pollution members as raw JSON text: JSON.stringify would drop an own `__proto__` key. */
export const PROTO_MEMBERS = [
  '"__proto__":{"polluted":"yes"}',
  '"constructor":{"prototype":{"polluted":"yes"}}',
  '"prototype":{"polluted":"yes"}',
  '"__proto__":{"__proto__":{"polluted":"yes"}}',
  '"__proto__":null',
];

const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;
const unstorable = (text: string) => text.includes('\u0000') || LONE_SURROGATE.test(text);

/**
 * Whether a JSON value holds a string (or key) that cannot be stored as sent, and so must be refused rather than
 * altered: NUL (PostgreSQL documentation, 8.3 Character Types: "the character with code zero cannot be stored"), or
 * a lone surrogate, which is no Unicode scalar value and has no UTF-8 form (RFC 8259 section 8.2; Unicode 15, 3.9).
 */
export function hasUnstorableText(value: unknown): boolean {
  const stack = [value];
  while (stack.length > 0) {
    const v = stack.pop();
    if (typeof v === 'string' && unstorable(v)) return true;
    if (v !== null && typeof v === 'object') {
      for (const [k, child] of Object.entries(v)) {
        if (unstorable(k)) return true;
        stack.push(child);
      }
    }
  }
  return false;
}

/** `depth` nested objects around a number, as JSON text. */
export const deeplyNested = (depth: number) => `${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`;
/** An array of n zeros, as JSON text. */
export const longArray = (n: number) => `[${'0,'.repeat(n - 1)}0]`;

const PROTOTYPES = { Object: Object.prototype, Array: Array.prototype, Function: Function.prototype };
const snapshotPrototypes = () =>
  Object.fromEntries(Object.entries(PROTOTYPES).map(([n, p]) => [n, Object.getOwnPropertyNames(p).sort()]));
const PRISTINE = snapshotPrototypes();

/**
 * Object.prototype and friends carry no new properties: OWASP ASVS 4.0.3 5.5.3 (untrusted JSON deserialised safely)
 * and the OWASP Prototype Pollution Prevention Cheat Sheet.
 */
export function expectPrototypesClean(context: string) {
  expect(snapshotPrototypes(), context).toEqual(PRISTINE);
  expect(({} as Record<string, unknown>).polluted, context).toBeUndefined();
}

/** The one error shape of server/middleware/error-handler.ts. */
export function expectErrorShape(
  res: { status: number; body: unknown; headers: Record<string, string> },
  context: string,
) {
  expect(res.headers['content-type'], context).toMatch(/^application\/json/);
  const parsed = apiErrorSchema.safeParse(res.body);
  expect(parsed.success, `${context}: ${JSON.stringify(res.body)?.slice(0, 300)}`).toBe(true);
  const error = (res.body as { error: { code: string; message: string } }).error;
  expect(error.code, context).toMatch(/^[A-Z][A-Z0-9_]*$/);
  expect(error.message.length, context).toBeGreaterThan(0);
}

// better-auth refreshes session rows as it reads them; every other table is the application's state.
const UNWATCHED = new Set(['session', 'verification']);
const TABLES = (Object.values(schema) as unknown[])
  .filter((v): v is PgTable => is(v, PgTable))
  .map((t) => getTableName(t))
  .filter((name) => !UNWATCHED.has(name));

/**
 * Row count and newest row version (xmin) of every application table, in one query: an insert, an update or a
 * delete anywhere changes it, and a rolled-back write leaves it as it was (PostgreSQL documentation, 5.6 System
 * Columns: xmin is the transaction that wrote the row version).
 */
export async function fingerprint(db: Db): Promise<Record<string, string>> {
  const query = TABLES.map(
    (t) => `select '${t}' as t, count(*) || ':' || coalesce(max(x.xmin::text::bigint), 0) as h from "${t}" x`,
  ).join(' union all ');
  const result = (await db.execute(sql.raw(query))) as unknown as { rows: { t: string; h: string }[] };
  return Object.fromEntries(result.rows.map((r) => [r.t, r.h]));
}
