import { createHash, randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { copyFile, constants as fsConstants, readFile, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';

/** Where uploaded files live. The local folder today; object storage can take its place behind this interface. */
export interface Storage {
  /** Stores bytes under a new key and returns it with the SHA-256 of the content. */
  put(bytes: Buffer, hint: string): Promise<{ key: string; sha256: string }>;
  /** Stores a file already on disk (an upload's temp file) by streaming it; the caller has its SHA-256. */
  putFile(file: string, hint: string): Promise<{ key: string }>;
  get(key: string): Promise<Buffer>;
  remove(key: string): Promise<void>;
}

const KEY = /^[a-z0-9-]+\/[0-9a-f-]{36}$/;

/** Files under DATA_DIR/uploads (outside any static folder), named by random keys, never by the upload's name. */
export function localStorage(root: string): Storage {
  mkdirSync(root, { recursive: true });
  const fileOf = (key: string) => {
    if (!KEY.test(key)) throw new Error(`Bad storage key: ${key}`);
    return path.join(root, key);
  };
  return {
    async put(bytes, hint) {
      const folder =
        hint
          .toLowerCase()
          .replace(/[^a-z0-9-]/g, '-')
          .slice(0, 40) || 'file';
      const key = `${folder}/${randomUUID()}`;
      mkdirSync(path.join(root, folder), { recursive: true });
      await writeFile(fileOf(key), bytes, { flag: 'wx' });
      return { key, sha256: createHash('sha256').update(bytes).digest('hex') };
    },
    async putFile(file, hint) {
      const folder =
        hint
          .toLowerCase()
          .replace(/[^a-z0-9-]/g, '-')
          .slice(0, 40) || 'file';
      const key = `${folder}/${randomUUID()}`;
      mkdirSync(path.join(root, folder), { recursive: true });
      await copyFile(file, fileOf(key), fsConstants.COPYFILE_EXCL);
      return { key };
    },
    get: (key) => readFile(fileOf(key)),
    remove: (key) => rm(fileOf(key), { force: true }),
  };
}

/** In memory, for tests; `files` starts it with files already stored (a seeded snapshot's), by key. */
export function memoryStorage(files = new Map<string, Buffer>()): Storage {
  return {
    async put(bytes, hint) {
      const key = `${hint.toLowerCase().replace(/[^a-z0-9-]/g, '-') || 'file'}/${randomUUID()}`;
      files.set(key, Buffer.from(bytes));
      return { key, sha256: createHash('sha256').update(bytes).digest('hex') };
    },
    async putFile(file, hint) {
      const key = `${hint.toLowerCase().replace(/[^a-z0-9-]/g, '-') || 'file'}/${randomUUID()}`;
      files.set(key, await readFile(file));
      return { key };
    },
    async get(key) {
      const bytes = files.get(key);
      if (!bytes) throw new Error(`No stored file ${key}`);
      return bytes;
    },
    async remove(key) {
      files.delete(key);
    },
  };
}
