import { createHash, randomUUID } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { stat } from 'node:fs/promises';
import type { S3Client } from '@aws-sdk/client-s3';
import type { Env } from '../../env';
import type { Storage } from './storage';

export type S3Options = {
  bucket: string;
  /** An S3-compatible endpoint (MinIO, a local stand-in); AWS itself when absent. */
  endpoint?: string;
  region: string;
  /** Path-style addressing (`endpoint/bucket/key`), which most S3-compatible stores need. */
  forcePathStyle: boolean;
  /** Explicit keys (tests, a stand-in); otherwise the SDK's own chain (AWS_ACCESS_KEY_ID..., an instance role). */
  credentials?: { accessKeyId: string; secretAccessKey: string };
};

const folderOf = (hint: string) =>
  hint
    .toLowerCase()
    .replace(/[^a-z0-9-]/g, '-')
    .slice(0, 40) || 'file';

/** The bucket and store from the environment (S3_BUCKET and its companions), or null when uploads stay local. */
export function s3OptionsFromEnv(env: Env): S3Options | null {
  if (!env.S3_BUCKET) return null;
  return {
    bucket: env.S3_BUCKET,
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: (env.S3_FORCE_PATH_STYLE ?? (env.S3_ENDPOINT ? 'true' : 'false')) === 'true',
  };
}

/** An SDK client for the store (loaded on first use). */
export async function s3Client(options: S3Options): Promise<S3Client> {
  const { S3Client } = await import('@aws-sdk/client-s3');
  return new S3Client({
    region: options.region,
    forcePathStyle: options.forcePathStyle,
    // Checksums only where S3 requires them: the SDK's default sends a streamed body as aws-chunked with a trailing
    // checksum, which several S3-compatible stores (the test stand-in among them) store as is, framing and all.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    ...(options.endpoint ? { endpoint: options.endpoint } : {}),
    ...(options.credentials ? { credentials: options.credentials } : {}),
  });
}

/**
 * Uploads in an S3-compatible bucket through the AWS SDK, for several app servers sharing one store (issue 16).
 * Keys are random, as in the local folder; the SDK loads only when a bucket is configured.
 */
export async function s3Storage(options: S3Options): Promise<Storage> {
  const { PutObjectCommand, GetObjectCommand, DeleteObjectCommand } = await import('@aws-sdk/client-s3');
  const client = await s3Client(options);
  const Bucket = options.bucket;
  return {
    async put(bytes, hint) {
      const key = `${folderOf(hint)}/${randomUUID()}`;
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: bytes, ContentLength: bytes.length }));
      return { key, sha256: createHash('sha256').update(bytes).digest('hex') };
    },
    async putFile(file, hint) {
      const key = `${folderOf(hint)}/${randomUUID()}`;
      const { size } = await stat(file);
      // Streamed from the upload's temp file: a large file is never held in memory whole.
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: createReadStream(file), ContentLength: size }));
      return { key };
    },
    async get(key) {
      const answer = await client.send(new GetObjectCommand({ Bucket, Key: key }));
      if (!answer.Body) throw new Error(`No stored file ${key}`);
      return Buffer.from(await answer.Body.transformToByteArray());
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
  };
}
