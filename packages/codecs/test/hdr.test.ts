import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { CodecError, decodeHdr, encodeHdr, encodeRgbePixel, readHdrHeader, type FloatImage } from '@lightkiln/codecs';
import { hasTool, runTool, withTempDir } from '../../../test/helpers/tools.js';

const parseHdr = createRequire(import.meta.url)('parse-hdr') as (b: Uint8Array) => { shape: [number, number]; data: Float32Array };

function gradient(width: number, height: number): FloatImage {
  const data = new Float32Array(width * height * 3);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 3;
      data[i] = Math.pow(2, (x / width) * 20 - 10);
      data[i + 1] = (y + 1) / height;
      data[i + 2] = x === 3 ? 5000 : 0.001 * (x + y);
    }
  }
  return { width, height, channels: 3, data };
}

function rgbe(r: number, g: number, b: number): number[] {
  const out = new Uint8Array(4);
  encodeRgbePixel(out, 0, r, g, b);
  return [...out];
}

/** A flat (non-RLE) file with a chosen resolution string and stored pixels. */
function flatFile(resolution: string, pixels: number[][], extraHeader = ''): Uint8Array {
  const head = new TextEncoder().encode(`#?RGBE\nFORMAT=32-bit_rle_rgbe\n${extraHeader}\n${resolution}\n`);
  const out = new Uint8Array(head.length + pixels.length * 4);
  out.set(head);
  pixels.forEach((p, i) => out.set(p, head.length + i * 4));
  return out;
}

describe('RGBE pixels (Ward 1991, "Real Pixels")', () => {
  it('encodes the reference colours, rounding to nearest', () => {
    expect(rgbe(1, 1, 1)).toEqual([128, 128, 128, 129]);
    expect(rgbe(1000, 1, 0.001)).toEqual([250, 0, 0, 138]);
    expect(rgbe(0.18, 0.18, 0.18)).toEqual([184, 184, 184, 126]);
    expect(rgbe(0, 0, 0)).toEqual([0, 0, 0, 0]);
    expect(rgbe(-1, 0, 0)).toEqual([0, 0, 0, 0]);
    expect(rgbe(255.9, 0, 0)).toEqual([128, 0, 0, 137]); // rounds up into the next exponent
  });

  it('decodes m * 2^(e - 136), e = 0 black (README, Conventions)', () => {
    const image = decodeHdr(flatFile('-Y 1 +X 3', [[128, 128, 128, 129], [250, 0, 0, 138], [7, 7, 7, 0]]));
    expect([...image.data]).toEqual([1, 1, 1, 1000, 0, 0, 0, 0, 0]);
  });

  it('round-trips within half a step of the largest channel, RLE and flat', () => {
    for (const width of [5, 64, 300]) {
      const src = gradient(width, 7);
      for (const runLength of [true, false]) {
        const back = decodeHdr(encodeHdr(src, { runLength }));
        expect(back.width).toBe(width);
        for (let p = 0; p < width * 7; p++) {
          const maxc = Math.max(src.data[p * 3]!, src.data[p * 3 + 1]!, src.data[p * 3 + 2]!);
          const step = Math.pow(2, Math.floor(Math.log2(maxc)) + 1 - 8);
          for (let c = 0; c < 3; c++) expect(Math.abs(back.data[p * 3 + c]! - src.data[p * 3 + c]!)).toBeLessThanOrEqual(step / 2 * (1 + 1e-6));
        }
      }
    }
  });

  it('compresses runs with new-style RLE (published check values)', () => {
    const flat: FloatImage = { width: 256, height: 4, channels: 3, data: new Float32Array(256 * 4 * 3).fill(0.5) };
    const bytes = encodeHdr(flat);
    expect(bytes.length).toBeLessThan(200);
    const header = readHdrHeader(bytes);
    expect([...bytes.subarray(header.dataOffset, header.dataOffset + 4)]).toEqual([2, 2, 1, 0]);
  });
});

describe('header and orientation', () => {
  it('honours cumulative EXPOSURE (true value = stored / exposure)', () => {
    const image = decodeHdr(flatFile('-Y 1 +X 1', [[128, 128, 128, 129]], 'EXPOSURE=2\nEXPOSURE=0.25\n'));
    expect(image.data[0]).toBe(2);
  });

  it('reads every orientation of the resolution string into top-down, left-to-right order', () => {
    // Pixel values 1..6 encode as (128, 0, 0, 129 + k) -> 2^k; stored order differs by orientation.
    const px = (k: number): number[] => [128, 0, 0, 129 + k];
    const expectGrid = (bytes: Uint8Array, w: number, grid: number[]): void => {
      const image = decodeHdr(bytes);
      expect(image.width).toBe(w);
      expect(Array.from({ length: grid.length }, (_, i) => Math.log2(image.data[i * 3]!))).toEqual(grid);
    };
    // A 3 x 2 picture with values [[0, 1, 2], [3, 4, 5]] (top row first).
    expectGrid(flatFile('-Y 2 +X 3', [0, 1, 2, 3, 4, 5].map(px)), 3, [0, 1, 2, 3, 4, 5]);
    expectGrid(flatFile('+Y 2 +X 3', [3, 4, 5, 0, 1, 2].map(px)), 3, [0, 1, 2, 3, 4, 5]);
    expectGrid(flatFile('-Y 2 -X 3', [2, 1, 0, 5, 4, 3].map(px)), 3, [0, 1, 2, 3, 4, 5]);
    expectGrid(flatFile('+Y 2 -X 3', [5, 4, 3, 2, 1, 0].map(px)), 3, [0, 1, 2, 3, 4, 5]);
    expectGrid(flatFile('+X 3 -Y 2', [0, 3, 1, 4, 2, 5].map(px)), 3, [0, 1, 2, 3, 4, 5]);
    expectGrid(flatFile('+X 3 +Y 2', [3, 0, 4, 1, 5, 2].map(px)), 3, [0, 1, 2, 3, 4, 5]);
    expectGrid(flatFile('-X 3 -Y 2', [2, 5, 1, 4, 0, 3].map(px)), 3, [0, 1, 2, 3, 4, 5]);
    expectGrid(flatFile('-X 3 +Y 2', [5, 2, 4, 1, 3, 0].map(px)), 3, [0, 1, 2, 3, 4, 5]);
  });

  it('reads the old run-length form (1, 1, 1, n)', () => {
    const image = decodeHdr(flatFile('-Y 1 +X 5', [[128, 0, 0, 129], [1, 1, 1, 4]]));
    expect([...image.data].filter((_, i) => i % 3 === 0)).toEqual([1, 1, 1, 1, 1]);
  });

  it('refuses XYZE and foreign program types with a typed error', () => {
    const xyze = new TextEncoder().encode('#?RADIANCE\nFORMAT=32-bit_rle_xyze\n\n-Y 1 +X 1\n\0\0\0\0');
    expect(() => decodeHdr(xyze, { file: 'sky.hdr' })).toThrow(/sky.hdr: unsupported feature: FORMAT=32-bit_rle_xyze/);
    const other = new TextEncoder().encode('#?OTHER\n\n-Y 1 +X 1\n\0\0\0\0');
    expect(() => decodeHdr(other)).toThrow(CodecError);
  });
});

describe('independent readers', () => {
  it('parse-hdr reads our files; its 1/255 mantissa scale reads 256/255 of ours (pins the convention)', () => {
    const src = gradient(64, 9);
    const bytes = encodeHdr(src);
    const ours = decodeHdr(bytes);
    const theirs = parseHdr(bytes);
    expect(theirs.shape).toEqual([64, 9]);
    for (let p = 0; p < 64 * 9; p++) {
      for (let c = 0; c < 3; c++) expect(Math.abs(theirs.data[p * 4 + c]! * (255 / 256) - ours.data[p * 3 + c]!)).toBeLessThanOrEqual(1e-6 * Math.abs(ours.data[p * 3 + c]!) + 1e-12);
    }
    // (128, 128, 128, 129): 1.0 for us, 128/255 * 2 for parse-hdr.
    expect(parseHdr(flatFile('-Y 1 +X 1', [[128, 128, 128, 129]])).data[0]).toBeCloseTo(256 / 255, 6);
  });

  it.runIf(hasTool('convert'))('ImageMagick (Debian imagemagick) decodes our files to the same floats', () => {
    withTempDir((dir) => {
      // Debian's ImageMagick is a Q16 build without HDRI: it clamps to [0, 1] and keeps 16 bits, so the
      // picture stays below 1 and "-set colorspace sRGB" stops it re-encoding linear values to sRGB.
      const src = gradient(40, 6);
      for (let i = 0; i < src.data.length; i++) src.data[i] = Math.min(1, src.data[i]! / 4);
      const ours = decodeHdr(encodeHdr(src));
      writeFileSync(join(dir, 'g.hdr'), encodeHdr(src));
      const r = runTool('convert', [join(dir, 'g.hdr'), '-set', 'colorspace', 'sRGB', '-define', 'quantum:format=floating-point', '-depth', '32', '-endian', 'LSB', `rgb:${join(dir, 'g.raw')}`]);
      expect(r.status, r.stderr).toBe(0);
      const raw = readFileSync(join(dir, 'g.raw'));
      const theirs = new Float32Array(raw.buffer, raw.byteOffset, raw.length / 4);
      expect(theirs.length).toBe(ours.data.length);
      for (let p = 0; p < 40 * 6; p++) {
        const maxc = Math.max(ours.data[p * 3]!, ours.data[p * 3 + 1]!, ours.data[p * 3 + 2]!);
        for (let c = 0; c < 3; c++) expect(Math.abs(theirs[p * 3 + c]! - ours.data[p * 3 + c]!)).toBeLessThanOrEqual(maxc / 256 + 2 / 65535);
      }
    });
  });
});
