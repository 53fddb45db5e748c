import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import parseExr from 'parse-exr';
import { binary16ToFloat32, float32ToBinary16 } from '@lightkiln/math';
import { decodeExr, decodePfm, encodeExr, encodePfm, readExrHeader, type ExrCompression, type FloatImage } from '@lightkiln/codecs';
import { hasTool, runTool, withTempDir } from '../../../test/helpers/tools.js';

function picture(width: number, height: number, channels: number): FloatImage {
  const data = new Float32Array(width * height * channels);
  for (let i = 0; i < data.length; i++) data[i] = Math.sin(i * 0.731) * 40 + (i % 7) * 0.01;
  for (let i = 0; i < data.length; i += 5) data[i] = Math.abs(data[i]!);
  return { width, height, channels, data };
}

const halfRound = (v: number): number => binary16ToFloat32(float32ToBinary16(v));

describe('OpenEXR scanline files ("OpenEXR File Layout", ASWF)', () => {
  const cases: [ExrCompression, 'half' | 'float', number][] = [];
  for (const c of ['none', 'zips', 'zip'] as const) for (const t of ['half', 'float'] as const) for (const ch of [3, 4]) cases.push([c, t, ch]);

  for (const [compression, pixelType, channels] of cases) {
    it(`round-trips ${compression} ${pixelType} with ${channels} channels, and parse-exr agrees`, () => {
      const src = picture(37, 21, channels); // 21 rows: the last ZIP block holds 5 lines
      const bytes = encodeExr(src, { compression, pixelType });
      const back = decodeExr(bytes);
      expect([back.width, back.height, back.channels]).toEqual([37, 21, channels]);
      const expected = pixelType === 'half' ? Array.from(src.data, halfRound) : Array.from(src.data);
      expect(Array.from(back.data)).toEqual(expected);
      // Independent decoder from the registry (parse-exr, FloatType = 1015): RGBA float. It is a port of a
      // WebGL loader and returns rows bottom-up (ready for a GL upload), so its row k is our row H-1-k.
      const theirs = parseExr(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength), 1015);
      expect([theirs.width, theirs.height]).toEqual([37, 21]);
      const stride = (theirs.data as Float32Array).length / (37 * 21);
      let maxDiff = 0;
      for (let p = 0; p < 37 * 21; p++) {
        const q = (20 - Math.floor(p / 37)) * 37 + (p % 37);
        for (let c = 0; c < channels; c++) maxDiff = Math.max(maxDiff, Math.abs((theirs.data as Float32Array)[q * stride + c]! - back.data[p * channels + c]!));
      }
      expect(maxDiff).toBe(0);
    });
  }

  it('writes the required header attributes and a valid offset table', () => {
    const bytes = encodeExr(picture(4, 3, 3), { compression: 'none', pixelType: 'half' });
    const header = readExrHeader(bytes);
    expect([...header.attributes.keys()].sort()).toEqual(['channels', 'compression', 'dataWindow', 'displayWindow', 'lineOrder', 'pixelAspectRatio', 'screenWindowCenter', 'screenWindowWidth']);
    expect(header.channels.map((c) => c.name)).toEqual(['B', 'G', 'R']);
    expect([...bytes.subarray(0, 4)]).toEqual([0x76, 0x2f, 0x31, 0x01]);
    const view = new DataView(bytes.buffer, bytes.byteOffset);
    const first = Number(view.getBigUint64(header.headerEnd, true));
    expect(first).toBe(header.headerEnd + 3 * 8);
    expect(view.getInt32(first, true)).toBe(0); // y of the first block
    expect(view.getInt32(first + 4, true)).toBe(4 * 3 * 2); // one line, three half channels
  });

  it.runIf(hasTool('exrheader'))('is accepted by the OpenEXR tools (Debian openexr: exrheader, exrinfo --strict)', () => {
    withTempDir((dir) => {
      for (const [compression, pixelType] of [['none', 'half'], ['zips', 'float'], ['zip', 'half']] as const) {
        const path = join(dir, `${compression}.exr`);
        writeFileSync(path, encodeExr(picture(33, 19, 4), { compression, pixelType }));
        const r = runTool('exrheader', [path]);
        expect(r.status, r.stderr).toBe(0);
        expect(r.stdout).toMatch(new RegExp(`compression \\(type compression\\): ${compression === 'none' ? 'none' : compression === 'zips' ? 'zip, individual scanlines' : 'zip, multi-scanline blocks'}`));
        expect(r.stdout).toMatch(/dataWindow \(type box2i\): \(0 0\) - \(32 18\)/);
        expect(r.stdout).toMatch(new RegExp(`R, ${pixelType === 'half' ? '16-bit floating-point' : '32-bit floating-point'}`));
        if (hasTool('exrinfo')) {
          const strict = runTool('exrinfo', ['-v', '-s', path]);
          expect(strict.status, strict.stdout + strict.stderr).toBe(0);
        }
      }
    });
  });
});

describe('PFM (common practice: bottom-to-top rows, sign of scale = byte order)', () => {
  it('round-trips colour and grey, both byte orders', () => {
    for (const channels of [1, 3]) {
      for (const littleEndian of [true, false]) {
        const src = picture(9, 5, channels);
        const back = decodePfm(encodePfm(src, { littleEndian }));
        expect([back.width, back.height, back.channels]).toEqual([9, 5, channels]);
        expect(Array.from(back.data)).toEqual(Array.from(src.data));
      }
    }
  });

  it('stores the bottom row first', () => {
    const head = new TextEncoder().encode('Pf\n1 2\n-1.0\n');
    const bytes = new Uint8Array(head.length + 8);
    bytes.set(head);
    const v = new DataView(bytes.buffer, head.length);
    v.setFloat32(0, 7, true); // stored first = bottom row
    v.setFloat32(4, 3, true);
    expect(Array.from(decodePfm(bytes).data)).toEqual([3, 7]);
  });
});
