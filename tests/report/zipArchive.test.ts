/**
 * The ZIP container of results.xlsx: CRC-32 against the check value of the CRC-32 used by ZIP
 * (the ASCII string "123456789" gives 0xCBF43926: the standard check value of this CRC, from
 * memory), and a round trip through an independent reader (Python's zipfile module, which checks
 * every CRC) when python3 is installed. Invented file contents.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { deflateRawSync } from 'node:zlib';
import { crc32, zipArchive, zipArchiveAsync } from '../../src/report/zipArchive.js';

const HAVE_PYTHON = spawnSync('python3', ['-c', 'import zipfile']).status === 0;

describe('zipArchive', () => {
  it('CRC-32 of "123456789" is 0xCBF43926 (check value, from memory); of nothing 0', () => {
    expect(crc32(Buffer.from('123456789', 'ascii'))).toBe(0xcbf43926);
    expect(crc32(new Uint8Array(0))).toBe(0);
  });

  it('compresses each entry to the bytes of DEFLATE level 2 with zlib\'s default output chunks (large chunks change nothing), in both forms', async () => {
    const big = Buffer.from(Array.from({ length: 60_000 }, (_, k) => `<row r="${k + 1}"><c r="A${k + 1}"><v>${(k % 97) / 7}</v></c></row>`).join(''), 'utf8');
    const files = [{ name: 'big.xml', data: big }, { name: 'small.xml', data: '<x>ö</x>' }];
    const when = new Date(Date.UTC(2026, 0, 2));
    const sync = Buffer.from(zipArchive(files, when));
    expect(Buffer.from(await zipArchiveAsync(files, when)).equals(sync)).toBe(true);
    const packed = deflateRawSync(big, { level: 2 });
    expect(sync.readUInt32LE(18)).toBe(packed.length);
    expect(sync.subarray(30 + 'big.xml'.length, 30 + 'big.xml'.length + packed.length).equals(packed)).toBe(true);
  });

  it.skipIf(!HAVE_PYTHON)('an independent reader lists the files and reads them back byte for byte (CRCs checked)', () => {
    const files = [
      { name: 'a.txt', data: 'hello, Lindqvarn (invented)\n'.repeat(1000) },
      { name: 'dir/ü.xml', data: '<x>ö</x>' },
      { name: 'empty', data: new Uint8Array(0) },
    ];
    const dir = mkdtempSync(join(tmpdir(), 'sorbshare-zip-'));
    try {
      const path = join(dir, 't.zip');
      writeFileSync(path, zipArchive(files, new Date(Date.UTC(2026, 0, 15, 12, 30, 10))));
      const py = 'import zipfile,sys,json\nz=zipfile.ZipFile(sys.argv[1])\nassert z.testzip() is None\nprint(json.dumps({i.filename: [z.read(i).decode("utf-8"), list(i.date_time)] for i in z.infolist()}))';
      const r = spawnSync('python3', ['-c', py, path], { encoding: 'utf8' });
      expect(r.status, r.stderr).toBe(0);
      const got = JSON.parse(r.stdout) as Record<string, [string, number[]]>;
      expect(Object.keys(got)).toEqual(files.map((f) => f.name));
      for (const f of files) expect(got[f.name]![0]).toBe(typeof f.data === 'string' ? f.data : '');
      expect(got['a.txt']![1]).toEqual([2026, 1, 15, 12, 30, 10]);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
