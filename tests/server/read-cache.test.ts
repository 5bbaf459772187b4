import { describe, expect, it } from 'vitest';
import { readCache, serializeJson, type SerializedBody } from '../../server/lib/read-cache';

// The answer cache's own rules, without a database (server/lib/read-cache.ts). Entity tags: RFC 9110 section 8.8.3.
const body = (text: string) => serializeJson({ text });
const counting = () => {
  let builds = 0;
  const build = (text: string) => async () => {
    builds += 1;
    return body(text);
  };
  return { build, builds: () => builds };
};
const textOf = (answer: SerializedBody) => (JSON.parse(answer.bytes.toString('utf8')) as { text: string }).text;

describe('readCache', () => {
  it('answers from memory only at the same version, for the same viewer and roles', async () => {
    const cache = readCache();
    const c = counting();
    expect(textOf(await cache.answer('app', 'ann', '5', 'owner', c.build('first')))).toBe('first');
    expect(textOf(await cache.answer('app', 'ann', '5', 'owner', c.build('second')))).toBe('first');
    expect(c.builds()).toBe(1);
    expect(textOf(await cache.answer('app', 'ann', '6', 'owner', c.build('newer')))).toBe('newer');
    expect(textOf(await cache.answer('app', 'ann', '6', 'owner,owner_admin', c.build('other roles')))).toBe(
      'other roles',
    );
    expect(textOf(await cache.answer('app', 'bob', '6', 'owner,owner_admin', c.build('bob')))).toBe('bob');
    expect(textOf(await cache.answer('other', 'bob', '6', 'owner,owner_admin', c.build('other app')))).toBe(
      'other app',
    );
    expect(c.builds()).toBe(5);
  });

  it('never keeps an answer without a version', async () => {
    const cache = readCache();
    const c = counting();
    await cache.answer('app', 'ann', null, 'owner', c.build('a'));
    expect(textOf(await cache.answer('app', 'ann', null, 'owner', c.build('b')))).toBe('b');
    expect(c.builds()).toBe(2);
  });

  it('builds once for readers that miss together, and an older build never replaces a newer answer', async () => {
    const cache = readCache();
    const c = counting();
    const together = await Promise.all([1, 2, 3].map(() => cache.answer('app', 'ann', '7', 'gc', c.build('shared'))));
    expect(together.map(textOf)).toEqual(['shared', 'shared', 'shared']);
    expect(c.builds()).toBe(1);
    let release: () => void = () => {};
    const slow = cache.answer(
      'app',
      'ann',
      '7',
      'sub',
      () => new Promise<SerializedBody>((r) => (release = () => r(body('old')))),
    );
    await cache.answer('app', 'ann', '8', 'sub', c.build('new'));
    release();
    await slow;
    expect(textOf(await cache.answer('app', 'ann', '8', 'sub', c.build('again')))).toBe('new');
  });

  it('keeps no more bytes than its bound, dropping the least recently used', async () => {
    const big = 'x'.repeat(4000);
    const cache = readCache(10_000);
    const c = counting();
    await cache.answer('a', 'ann', '1', 'gc', c.build(big));
    await cache.answer('b', 'ann', '1', 'gc', c.build(big));
    await cache.answer('c', 'ann', '1', 'gc', c.build(big));
    expect(c.builds()).toBe(3);
    await cache.answer('c', 'ann', '1', 'gc', c.build(big));
    expect(c.builds()).toBe(3);
    await cache.answer('a', 'ann', '1', 'gc', c.build(big));
    expect(c.builds()).toBe(4);
  });

  it('tags the bytes as Express would (weak: length and SHA-1), so equal answers have equal tags', () => {
    expect(body('same').etag).toBe(body('same').etag);
    expect(body('same').etag).not.toBe(body('other').etag);
    expect(body('same').etag).toMatch(/^W\/"[0-9a-f]+-[A-Za-z0-9+/]{27}"$/);
  });
});
