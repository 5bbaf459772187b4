import { readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { crc32, deflateRawSync, deflateSync, gzipSync } from 'node:zlib';

const u32 = (n: number) => {
  const b = Buffer.alloc(4);
  b.writeUInt32BE(n >>> 0);
  return b;
};

function pngChunk(type: string, data: Buffer): Buffer {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  return Buffer.concat([u32(data.length), body, u32(crc32(body))]);
}

/** A real 1 x 1 grey PNG (PNG specification, ISO/IEC 15948: signature, IHDR, IDAT, IEND with their CRCs). */
export function tinyPng(): Buffer {
  const ihdr = Buffer.concat([u32(1), u32(1), Buffer.from([8, 0, 0, 0, 0])]); // 8-bit greyscale
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk('IHDR', ihdr),
    pngChunk('IDAT', deflateSync(Buffer.from([0, 0x80]))),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
}

/** The first bytes of a 64-bit Linux executable (ELF magic 7F 45 4C 46, System V ABI). */
export const elfHeader = () => Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]), Buffer.alloc(56, 0)]);

/**
 * A zip archive (PKWARE APPNOTE 6.3.x: local header, deflated data, central directory, end record) holding one
 * entry of `inflatedBytes` zero bytes: a few kB that inflate to many MB, a decompression bomb.
 */
export function zipBomb(inflatedBytes: number, entryName = 'data.csv'): Buffer {
  const plain = Buffer.alloc(inflatedBytes, 0x30);
  const data = deflateRawSync(plain, { level: 9 });
  const name = Buffer.from(entryName);
  const crc = crc32(plain);
  const le = (n: number, size: 2 | 4) => {
    const b = Buffer.alloc(size);
    if (size === 2) b.writeUInt16LE(n);
    else b.writeUInt32LE(n >>> 0);
    return b;
  };
  const common = Buffer.concat([
    le(20, 2),
    le(0, 2),
    le(8, 2),
    le(0, 2),
    le(0, 2),
    le(crc, 4),
    le(data.length, 4),
    le(plain.length, 4),
    le(name.length, 2),
    le(0, 2),
  ]);
  const local = Buffer.concat([le(0x04034b50, 4), common, name, data]);
  const central = Buffer.concat([
    le(0x02014b50, 4),
    le(20, 2),
    common,
    le(0, 2),
    le(0, 2),
    le(0, 2),
    le(0, 4),
    le(0, 4),
    name,
  ]);
  const end = Buffer.concat([
    le(0x06054b50, 4),
    le(0, 2),
    le(0, 2),
    le(1, 2),
    le(1, 2),
    le(central.length, 4),
    le(local.length, 4),
    le(0, 2),
  ]);
  return Buffer.concat([local, central, end]);
}

/** A gzip stream (RFC 1952) of `inflatedBytes` bytes of text. */
export const gzipBomb = (inflatedBytes: number) => gzipSync(Buffer.alloc(inflatedBytes, 0x30));

/** Every file under a folder, as paths relative to it. */
export function filesUnder(root: string): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const full = path.join(dir, name);
      if (statSync(full).isDirectory()) walk(full);
      else out.push(path.relative(root, full));
    }
  };
  walk(root);
  return out.sort();
}
