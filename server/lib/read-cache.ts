import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';

/** A JSON answer ready to send: its bytes and the entity tag of those bytes (RFC 9110 section 8.8.3). */
export type SerializedBody = { bytes: Buffer; etag: string };

type Entry = SerializedBody & { version: string; rolesKey: string };

/** 64 MiB of answers per app server: about three hundred 200-line pay applications. */
export const READ_CACHE_MAX_BYTES = 64 * 1024 * 1024;

/** The bytes res.json would send, tagged as Express tags them (a weak tag of length and SHA-1). */
export function serializeJson(value: unknown): SerializedBody {
  const bytes = Buffer.from(JSON.stringify(value), 'utf8');
  const hash = createHash('sha1').update(bytes).digest('base64').slice(0, 27);
  return { bytes, etag: `W/"${bytes.length.toString(16)}-${hash}"` };
}

/**
 * Answers of one kind of read, per object and viewer, valid only at the read version they were built at
 * (read_version, server/db/schema/read-version.ts) and for the roles the viewer held. The caller reads the version
 * and checks access on every request before asking; a missing version (null) never hits. Bounded by bytes (LRU).
 */
export function readCache(maxBytes = READ_CACHE_MAX_BYTES) {
  const entries = new LRUCache<string, Entry>({ maxSize: maxBytes, sizeCalculation: (e) => e.bytes.length + 200 });
  const keyOf = (objectId: string, userId: string) => `${objectId}\u0000${userId}`;
  return {
    get(objectId: string, userId: string, version: string | null, rolesKey: string): SerializedBody | undefined {
      if (version === null) return undefined;
      const hit = entries.get(keyOf(objectId, userId));
      return hit && hit.version === version && hit.rolesKey === rolesKey ? hit : undefined;
    },
    set(objectId: string, userId: string, version: string | null, rolesKey: string, body: SerializedBody): void {
      if (version !== null) entries.set(keyOf(objectId, userId), { ...body, version, rolesKey });
    },
  };
}

export type ReadCache = ReturnType<typeof readCache>;
