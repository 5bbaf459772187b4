import { createHash } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { CreateBucketCommand, S3Client } from '@aws-sdk/client-s3';
import S3rver from 's3rver';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { s3Storage } from '../../server/integrations/storage/s3-storage';
import type { Storage } from '../../server/integrations/storage/storage';

// Uploads in S3-compatible object storage (issue 16), against s3rver, a local S3-compatible stand-in from npm:
// what one app server stores, another reads (two Storage instances on one bucket), byte for byte with its SHA-256.
const credentials = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };
let server: S3rver;
let endpoint: string;
beforeAll(async () => {
  server = new S3rver({
    port: 0,
    address: '127.0.0.1',
    silent: true,
    directory: mkdtempSync(path.join(tmpdir(), 's3rver-')),
  });
  const { port } = await server.run();
  endpoint = `http://127.0.0.1:${port}`;
  const admin = new S3Client({ endpoint, region: 'us-east-1', forcePathStyle: true, credentials });
  await admin.send(new CreateBucketCommand({ Bucket: 'tallyard-test' }));
});
afterAll(() => server?.close());

const open = (): Promise<Storage> =>
  s3Storage({ bucket: 'tallyard-test', endpoint, region: 'us-east-1', forcePathStyle: true, credentials });

describe('S3-compatible storage', () => {
  it('reads back through a second server what the first stored, from bytes and from a temp file', async () => {
    const serverA = await open();
    const serverB = await open();
    const bytes = Buffer.from('station,cut_area,fill_area\n0+00,12.5,0\n');
    const stored = await serverA.put(bytes, 'evidence');
    expect(stored.key).toMatch(/^evidence\/[0-9a-f-]{36}$/);
    expect(stored.sha256).toBe(createHash('sha256').update(bytes).digest('hex'));
    expect(await serverB.get(stored.key)).toEqual(bytes);

    const file = path.join(mkdtempSync(path.join(tmpdir(), 'upload-')), 'survey.xml');
    const big = Buffer.alloc(3 * 1024 * 1024, 0x41);
    writeFileSync(file, big);
    const streamed = await serverA.putFile(file, 'Baseline Surface');
    expect(streamed.key).toMatch(/^baseline-surface\//);
    expect(
      createHash('sha256')
        .update(await serverB.get(streamed.key))
        .digest('hex'),
    ).toBe(createHash('sha256').update(big).digest('hex'));
  });

  it('removes a file for every server', async () => {
    const serverA = await open();
    const serverB = await open();
    const { key } = await serverA.put(Buffer.from('gone'), 'evidence');
    await serverB.remove(key);
    await expect(serverA.get(key)).rejects.toThrow();
  });
});
