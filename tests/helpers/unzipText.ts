/**
 * The files of a ZIP archive by name, as UTF-8 text: its local headers read in order and each
 * DEFLATE entry inflated with node:zlib (a decoder independent of src/report/zipArchive.ts).
 * For tests that read results.xlsx back.
 */
import { inflateRawSync } from 'node:zlib';

export function unzipText(bytes: Uint8Array): Record<string, string> {
  const b = Buffer.from(bytes);
  const out: Record<string, string> = {};
  let p = 0;
  while (b.readUInt32LE(p) === 0x04034b50) {
    const size = b.readUInt32LE(p + 18);
    const nameLen = b.readUInt16LE(p + 26);
    const extra = b.readUInt16LE(p + 28);
    const name = b.subarray(p + 30, p + 30 + nameLen).toString('utf8');
    const start = p + 30 + nameLen + extra;
    out[name] = inflateRawSync(b.subarray(start, start + size)).toString('utf8');
    p = start + size;
  }
  return out;
}
