import { createReadStream, createWriteStream, mkdirSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { s3Client, type S3Options } from '../integrations/storage/s3-storage';
import { BackupError } from './backup-archive';

/** A key the app writes (`folder/uuid`) or any plain relative path; never `..`, an absolute path or an empty part. */
function safeRelative(key: string): boolean {
  const parts = key.split('/');
  return !key.startsWith('/') && parts.every((p) => p !== '' && p !== '.' && p !== '..');
}

const where = (options: S3Options) => `bucket ${options.bucket}${options.endpoint ? ` at ${options.endpoint}` : ''}`;

const failed = (what: string, options: S3Options, err: unknown) =>
  new BackupError(`${what} ${where(options)} failed: ${err instanceof Error ? err.message : String(err)}`);

/**
 * Copies every object of the bucket into `folder`, each under its key as a path (the layout of DATA_DIR/uploads), one
 * at a time and streamed, so a large file is never held in memory. Answers how many objects were copied.
 */
export async function downloadBucket(options: S3Options, folder: string): Promise<number> {
  const { ListObjectsV2Command, GetObjectCommand } = await import('@aws-sdk/client-s3');
  const client = await s3Client(options);
  let count = 0;
  let token: string | undefined;
  try {
    do {
      const page = await client.send(new ListObjectsV2Command({ Bucket: options.bucket, ContinuationToken: token }));
      for (const { Key } of page.Contents ?? []) {
        if (!Key) continue;
        if (!safeRelative(Key))
          throw new BackupError(`The ${where(options)} holds an object named ${Key}, which cannot be a file name.`);
        const file = path.join(folder, ...Key.split('/'));
        mkdirSync(path.dirname(file), { recursive: true });
        const object = await client.send(new GetObjectCommand({ Bucket: options.bucket, Key }));
        if (!object.Body) throw new BackupError(`The ${where(options)} answered no content for ${Key}.`);
        await pipeline(object.Body as Readable, createWriteStream(file, { flags: 'wx' }));
        count++;
      }
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
  } catch (err) {
    if (err instanceof BackupError) throw err;
    throw failed('Copying the objects of', options, err);
  } finally {
    client.destroy();
  }
  return count;
}

function filesUnder(folder: string): string[] {
  return readdirSync(folder, { recursive: true, encoding: 'utf8' })
    .filter((name) => statSync(path.join(folder, name)).isFile())
    .sort();
}

/**
 * Puts every file under `folder` into the bucket under its relative path as the key (streamed). Objects already in
 * the bucket under other keys stay: keys are random and never reused, so they are files no restored row names.
 */
export async function uploadFolder(options: S3Options, folder: string): Promise<number> {
  const { PutObjectCommand } = await import('@aws-sdk/client-s3');
  const client = await s3Client(options);
  const files = filesUnder(folder);
  try {
    for (const name of files) {
      const full = path.join(folder, name);
      await client.send(
        new PutObjectCommand({
          Bucket: options.bucket,
          Key: name.split(path.sep).join('/'),
          Body: createReadStream(full),
          ContentLength: statSync(full).size,
        }),
      );
    }
  } catch (err) {
    throw failed('Putting the backed-up files into', options, err);
  } finally {
    client.destroy();
  }
  return files.length;
}

/** Says, before anything is changed, that the bucket answers with these settings (a restore checks this first). */
export async function checkBucket(options: S3Options): Promise<void> {
  const { HeadBucketCommand } = await import('@aws-sdk/client-s3');
  const client = await s3Client(options);
  try {
    await client.send(new HeadBucketCommand({ Bucket: options.bucket }));
  } catch (err) {
    throw failed('Reaching', options, err);
  } finally {
    client.destroy();
  }
}
