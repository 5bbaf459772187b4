import { afterEach, describe, expect, it, vi } from 'vitest';
import { api } from '@/lib/api-client';

// The client half of idempotent writes (IETF httpapi draft "The Idempotency-Key HTTP Header Field"): the same write
// sent again while the first is under way, or after its answer was lost, carries the same key.
type Call = { method: string; key: string | undefined };
function recordingFetch(answer: () => Promise<Response>) {
  const calls: Call[] = [];
  vi.stubGlobal('fetch', (_path: string, init: RequestInit) => {
    calls.push({ method: String(init.method), key: (init.headers as Record<string, string>)['Idempotency-Key'] });
    return answer();
  });
  return calls;
}
const ok = () => Promise.resolve(new Response('{"ok":true}', { status: 200 }));

afterEach(() => vi.unstubAllGlobals());

describe('Idempotency-Key on writes', () => {
  it('gives a double click one key, another body another key, and a later deliberate repeat a new key', async () => {
    const calls = recordingFetch(ok);
    await Promise.all([api.post('/api/x', { a: 1 }), api.post('/api/x', { a: 1 }), api.post('/api/x', { a: 2 })]);
    await api.post('/api/x', { a: 1 });
    await api.get('/api/x');
    const [first, second, other, later, read] = calls;
    expect(first!.key).toMatch(/^[0-9a-f]{32}$/);
    expect(second!.key).toBe(first!.key);
    expect(other!.key).not.toBe(first!.key);
    expect(later!.key).not.toBe(first!.key);
    expect(read!.key).toBeUndefined();
  });

  it('keeps the key of a write whose answer was lost, so sending it again is answered rather than redone', async () => {
    let lose = true;
    const calls = recordingFetch(() => (lose ? Promise.reject(new TypeError('network')) : ok()));
    await expect(api.patch('/api/y', { b: 1 })).rejects.toMatchObject({ code: 'NETWORK_ERROR' });
    lose = false;
    await api.patch('/api/y', { b: 1 });
    expect(calls[1]!.key).toBe(calls[0]!.key);
  });
});
