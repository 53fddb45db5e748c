/**
 * KTX 2.0 Zstandard supercompression (scheme 2, KTX 2.0 specification section 3.4; frames per RFC 8878):
 * every level of our files decodes with the Debian `zstd` tool and with fzstd (a registry decoder) to the
 * same bytes as the uncompressed file, and our reader round-trips it.
 */

import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { decompress } from 'fzstd';
import { decodeKtx2, encodeKtx2, initZstd, type Ktx2Format } from '@lightkiln/codecs';
import { hasTool, runTool, withTempDir } from '../../../test/helpers/tools.js';

await initZstd();

function cubeLevels(size: number, count: number): Float32Array[] {
  return Array.from({ length: count }, (_, l) => {
    const n = size >> l;
    const data = new Float32Array(n * n * 6 * 4);
    for (let i = 0; i < data.length; i++) data[i] = Math.sin(i * 0.37 + l) * 3 + 4;
    return data;
  });
}

/** Level payloads of a KTX 2.0 file, from its level index (byteOffset, byteLength, uncompressedByteLength). */
function levelPayloads(bytes: Uint8Array): { packed: Uint8Array; size: number }[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const levelCount = view.getUint32(40, true);
  return Array.from({ length: levelCount }, (_, l) => {
    const offset = Number(view.getBigUint64(80 + l * 24, true));
    const length = Number(view.getBigUint64(88 + l * 24, true));
    return { packed: bytes.subarray(offset, offset + length), size: Number(view.getBigUint64(96 + l * 24, true)) };
  });
}

describe('KTX 2.0 Zstandard supercompression', () => {
  for (const format of ['rgba16f', 'rgba32f'] as Ktx2Format[]) {
    const input = { format, width: 16, height: 16, faceCount: 6 as const, levels: cubeLevels(16, 3) };
    const plain = encodeKtx2(input);
    const packed = encodeKtx2({ ...input, supercompression: 'zstd' });

    it(`${format}: header says scheme 2, levels decode with fzstd to the uncompressed bytes, and our reader round-trips`, () => {
      expect(new DataView(packed.buffer, packed.byteOffset).getUint32(44, true)).toBe(2);
      const a = levelPayloads(plain);
      const b = levelPayloads(packed);
      b.forEach((level, l) => {
        expect(level.size).toBe(a[l]!.size);
        expect(Buffer.compare(Buffer.from(decompress(level.packed)), Buffer.from(a[l]!.packed))).toBe(0);
      });
      const decoded = decodeKtx2(packed);
      expect(decoded.supercompression).toBe('zstd');
      decoded.levels.forEach((level, l) => expect(Array.from(level.data)).toEqual(Array.from(decodeKtx2(plain).levels[l]!.data)));
      expect(packed.length).toBeLessThan(plain.length);
    });

    it.runIf(hasTool('zstd'))(`${format}: every level decodes with the Debian zstd tool`, () => {
      withTempDir((dir) => {
        const a = levelPayloads(plain);
        levelPayloads(packed).forEach((level, l) => {
          const file = join(dir, `level${l}.zst`);
          writeFileSync(file, level.packed);
          const r = runTool('zstd', ['-d', '-q', '-f', file, '-o', join(dir, `level${l}.raw`)]);
          expect(r.status, r.stderr).toBe(0);
          expect(Buffer.compare(readFileSync(join(dir, `level${l}.raw`)), Buffer.from(a[l]!.packed))).toBe(0);
        });
      });
    });
  }

  it('refuses a level whose frame declares another size, naming the file', () => {
    const bytes = encodeKtx2({ format: 'rgba32f', width: 4, height: 4, faceCount: 6, levels: cubeLevels(4, 1), supercompression: 'zstd' });
    const view = new DataView(bytes.buffer, bytes.byteOffset);
    const offset = Number(view.getBigUint64(80, true));
    const broken = bytes.slice();
    // The frame header descriptor (RFC 8878 3.1.1.1) is byte 4; flip the content-size field's low byte.
    const fhd = broken[offset + 4]!;
    const fcsAt = offset + 5 + ((fhd >> 5) & 1 ? 0 : 1) + [0, 1, 2, 4][fhd & 3]!;
    broken[fcsAt] = broken[fcsAt]! ^ 0x10;
    expect(() => decodeKtx2(broken, { file: 'broken.ktx2' })).toThrow(/broken\.ktx2/);
  });
});
