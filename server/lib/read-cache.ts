import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';

/** A JSON answer ready to send: its bytes and the entity tag of those bytes (RFC 9110 section 8.8.3). */
export type SerializedBody = { bytes: Buffer; etag: string };

type Entry = SerializedBody & { version: string; rolesKey: string; started: number };

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
 * (read_version, server/db/schema/read-version.ts) and for the roles the viewer holds now. The caller reads the
 * version and checks access on every request before asking; a missing version (null) is never cached. Readers
 * that miss at the same version share one build, and an older build never replaces a newer answer. Bounded by
 * bytes (LRU).
 */
export function readCache(maxBytes = READ_CACHE_MAX_BYTES) {
  const entries = new LRUCache<string, Entry>({ maxSize: maxBytes, sizeCalculation: (e) => e.bytes.length + 200 });
  const building = new Map<string, Promise<SerializedBody>>();
  // Builds in the order they started: one that started later read its version later, so it is at least as new.
  let builds = 0;
  const keyOf = (objectId: string, userId: string) => `${objectId}\u0000${userId}`;
  return {
    async answer(
      objectId: string,
      userId: string,
      version: string | null,
      rolesKey: string,
      build: () => Promise<SerializedBody>,
    ): Promise<SerializedBody> {
      if (version === null) return build();
      const key = keyOf(objectId, userId);
      const hit = entries.get(key);
      if (hit && hit.version === version && hit.rolesKey === rolesKey) return hit;
      const buildKey = `${key}\u0000${version}\u0000${rolesKey}`;
      const pending = building.get(buildKey);
      if (pending) return pending;
      const started = ++builds;
      const made = build().then((body) => {
        const now = entries.peek(key);
        if (!now || now.started < started) entries.set(key, { ...body, version, rolesKey, started });
        return body;
      });
      building.set(buildKey, made);
      try {
        return await made;
      } finally {
        building.delete(buildKey);
      }
    },
  };
}

export type ReadCache = ReturnType<typeof readCache>;
