/**
 * A ZIP archive (PKWARE APPNOTE.TXT, version 2.0: local file headers, DEFLATE, central directory,
 * end of central directory record) of a few files held in memory, as the container of an .xlsx
 * workbook (Office Open XML packages are ZIP archives, ECMA-376 Part 2). Names are UTF-8 (flag
 * bit 11); every entry carries the same fixed DOS time, so the same files give the same bytes.
 * Pure: returns the bytes, the caller writes them. Throws RangeError beyond ZIP's 4 GiB limits.
 */
import * as zlib from 'node:zlib';

/** CRC-32 (ISO 3309 / ITU-T V.42 polynomial 0xEDB88320, as ZIP uses), table-driven. */
const CRC_TABLE = (() => {
  const t = new Int32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    t[n] = c;
  }
  return t;
})();

// node:zlib's own CRC-32 (the same polynomial) where the Node version has it (20.15 and later)
const nativeCrc32 = (zlib as unknown as { crc32?: (data: Uint8Array) => number }).crc32;

export function crc32(data: Uint8Array): number {
  if (nativeCrc32) return nativeCrc32(data) >>> 0;
  let c = -1;
  for (let i = 0; i < data.length; i++) c = CRC_TABLE[(c ^ data[i]!) & 0xff]! ^ (c >>> 8);
  return (c ^ -1) >>> 0;
}

/** DOS date and time fields of a date (local fields taken as UTC; 1980 at the earliest). */
function dosDateTime(d: Date): { date: number; time: number } {
  const y = Math.max(1980, d.getUTCFullYear());
  return {
    date: ((y - 1980) << 9) | ((d.getUTCMonth() + 1) << 5) | d.getUTCDate(),
    time: (d.getUTCHours() << 11) | (d.getUTCMinutes() << 5) | (d.getUTCSeconds() >> 1),
  };
}

/** DEFLATE level of every entry: fast, and within a few per cent of the default level's size on sheet XML. */
const LEVEL = 2;

/**
 * zlib's options for an entry of `n` bytes: LEVEL, and an output chunk of about a quarter of the
 * entry (16 KiB to 8 MiB), so that a long sheet is compressed in one or two passes on the thread
 * pool instead of a few hundred 16 KiB ones (measured on a 23 MB sheet: about 110 instead of 130 ms
 * of CPU). The chunk size only cuts the output into pieces: the compressed bytes are the same.
 */
const deflateOptions = (n: number): zlib.ZlibOptions => ({ level: LEVEL, chunkSize: Math.max(16 * 1024, Math.min(n >>> 2, 8 * 1024 * 1024)) });

type ZipInput = ReadonlyArray<{ name: string; data: Uint8Array | string }>;
interface Packed { name: string; raw: Uint8Array; packed: Uint8Array }

const bytes = (data: Uint8Array | string): Uint8Array => (typeof data === 'string' ? Buffer.from(data, 'utf8') : data);

/**
 * @param files  file names (forward slashes) and contents, in archive order
 * @param when   the time stamp of every entry (default 1980-01-01)
 */
export function zipArchive(files: ZipInput, when = new Date(Date.UTC(1980, 0, 1))): Uint8Array {
  return assemble(files.map((f) => { const raw = bytes(f.data); return { name: f.name, raw, packed: zlib.deflateRawSync(raw, deflateOptions(raw.length)) }; }), when);
}

/**
 * The same archive as `zipArchive`, with every entry compressed on the thread pool (in parallel
 * with each other and with the caller's own work until it awaits).
 */
export async function zipArchiveAsync(files: ZipInput, when = new Date(Date.UTC(1980, 0, 1))): Promise<Uint8Array> {
  const packed = await Promise.all(files.map((f) => {
    const raw = bytes(f.data);
    return new Promise<Packed>((resolve, reject) => zlib.deflateRaw(raw, deflateOptions(raw.length), (e, out) => (e ? reject(e) : resolve({ name: f.name, raw, packed: out }))));
  }));
  return assemble(packed, when);
}

function assemble(files: readonly Packed[], when: Date): Uint8Array {
  const { date, time } = dosDateTime(when);
  const parts: Uint8Array[] = [];
  const central: Uint8Array[] = [];
  let offset = 0;
  for (const f of files) {
    const name = Buffer.from(f.name, 'utf8');
    const { raw, packed } = f;
    const crc = crc32(raw);
    if (raw.length >= 0xffffffff || offset >= 0xffffffff) throw new RangeError('ZIP archive: a file or the archive exceeds 4 GiB');
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0); // local file header signature
    local.writeUInt16LE(20, 4); // version needed: 2.0 (DEFLATE)
    local.writeUInt16LE(0x0800, 6); // UTF-8 names
    local.writeUInt16LE(8, 8); // DEFLATE
    local.writeUInt16LE(time, 10);
    local.writeUInt16LE(date, 12);
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(packed.length, 18);
    local.writeUInt32LE(raw.length, 22);
    local.writeUInt16LE(name.length, 26);
    local.writeUInt16LE(0, 28);
    const entry = Buffer.alloc(46);
    entry.writeUInt32LE(0x02014b50, 0); // central directory file header signature
    entry.writeUInt16LE(20, 4); // version made by
    entry.writeUInt16LE(20, 6); // version needed
    entry.writeUInt16LE(0x0800, 8);
    entry.writeUInt16LE(8, 10);
    entry.writeUInt16LE(time, 12);
    entry.writeUInt16LE(date, 14);
    entry.writeUInt32LE(crc, 16);
    entry.writeUInt32LE(packed.length, 20);
    entry.writeUInt32LE(raw.length, 24);
    entry.writeUInt16LE(name.length, 28);
    entry.writeUInt32LE(offset, 42); // offset of the local header
    parts.push(local, name, packed);
    central.push(entry, name);
    offset += local.length + name.length + packed.length;
  }
  const centralSize = central.reduce((s, b) => s + b.length, 0);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0); // end of central directory signature
  end.writeUInt16LE(files.length, 8);
  end.writeUInt16LE(files.length, 10);
  end.writeUInt32LE(centralSize, 12);
  end.writeUInt32LE(offset, 16);
  return new Uint8Array(Buffer.concat([...parts, ...central, end]));
}
