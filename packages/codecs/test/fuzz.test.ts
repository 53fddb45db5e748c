/**
 * Property-based fuzzing of every decoder (fast-check, from the registry): valid files of each format,
 * mutated by bit flips, byte overwrites in the header, truncation and extension. The only outcomes
 * allowed: a decoded image with consistent dimensions and a pixel array of the right length, or our
 * CodecError, within a decode-memory limit of 64 MiB (checked from the headers before allocating).
 * FUZZ_RUNS sets the cases per format (default 2000); `node test/fuzz-long.mjs` runs it for longer and
 * prints the seed of any failure.
 */

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CodecError, decodeImage, decodeKtx2, encodeExr, encodeHdr, encodeKtx2, encodePfm, encodePng, initZstd, type DecodeLimits } from '@lightkiln/codecs';

await initZstd();

const RUNS = Number(process.env.FUZZ_RUNS ?? 2000);
const SEED = process.env.FUZZ_SEED === undefined ? undefined : Number(process.env.FUZZ_SEED);
const LIMITS: DecodeLimits = { maxDecodeMemory: 64 * 2 ** 20, maxPixels: 2 ** 22 };

function pixels(width: number, height: number, channels: number): Float32Array {
  const data = new Float32Array(width * height * channels);
  for (let i = 0; i < data.length; i++) data[i] = ((i * 37) % 101) / 17;
  return data;
}

const rgba8 = new Uint8Array(12 * 8 * 4).map((_, i) => (i * 29) % 256);
const valid: Record<string, Uint8Array> = {
  hdr: encodeHdr({ width: 12, height: 8, channels: 3, data: pixels(12, 8, 3) }),
  pfm: encodePfm({ width: 12, height: 8, channels: 3, data: pixels(12, 8, 3) }),
  'exr-none': encodeExr({ width: 12, height: 8, channels: 3, data: pixels(12, 8, 3) }, { compression: 'none' }),
  'exr-zip': encodeExr({ width: 12, height: 8, channels: 4, data: pixels(12, 8, 4) }, { compression: 'zip' }),
  png: encodePng({ width: 12, height: 8, channels: 4, data: rgba8 }),
  'ktx2-zlib': encodeKtx2({ format: 'rgba16f', width: 4, height: 4, faceCount: 6, levels: [pixels(4, 4 * 6, 4), pixels(2, 2 * 6, 4)], supercompression: 'zlib' }),
  'ktx2-zstd': encodeKtx2({ format: 'rgba16f', width: 4, height: 4, faceCount: 6, levels: [pixels(4, 4 * 6, 4), pixels(2, 2 * 6, 4)], supercompression: 'zstd' }),
  ktx2: encodeKtx2({ format: 'rgba32f', width: 4, height: 4, faceCount: 6, levels: [pixels(4, 4 * 6, 4)] }),
};

/** A mutation of a valid file: flips, header overwrites, then a truncation or an extension. */
const mutation = fc.record({
  flips: fc.array(fc.record({ at: fc.nat(), bit: fc.integer({ min: 0, max: 7 }) }), { maxLength: 6 }),
  header: fc.array(fc.record({ at: fc.integer({ min: 0, max: 95 }), value: fc.integer({ min: 0, max: 255 }) }), { maxLength: 4 }),
  cut: fc.option(fc.nat(), { nil: undefined }),
  extra: fc.uint8Array({ maxLength: 64 }),
});

function mutate(base: Uint8Array, m: { flips: { at: number; bit: number }[]; header: { at: number; value: number }[]; cut: number | undefined; extra: Uint8Array }): Uint8Array {
  const bytes = base.slice();
  for (const f of m.flips) bytes[f.at % bytes.length]! ^= 1 << f.bit;
  for (const h of m.header) if (h.at < bytes.length) bytes[h.at] = h.value;
  const cut = m.cut === undefined ? bytes.length : m.cut % (bytes.length + 1);
  const out = new Uint8Array(cut + m.extra.length);
  out.set(bytes.subarray(0, cut));
  out.set(m.extra, cut);
  return out;
}

function decodeOrTypedError(name: string, bytes: Uint8Array): void {
  try {
    if (name.startsWith('ktx2')) {
      const k = decodeKtx2(bytes, { file: 'fuzz.ktx2', limits: LIMITS });
      expect(k.levels.length).toBeGreaterThan(0);
      for (const level of k.levels) expect(Number.isFinite(level.data.length)).toBe(true);
    } else {
      const img = decodeImage(bytes, { file: `fuzz.${name}`, limits: LIMITS });
      expect(img.width).toBeGreaterThan(0);
      expect(img.height).toBeGreaterThan(0);
      expect(img.data.length).toBe(img.width * img.height * img.channels);
    }
  } catch (error) {
    if (!(error instanceof CodecError)) throw new Error(`${name}: not a CodecError: ${error instanceof Error ? `${error.name}: ${error.message}` : String(error)}`);
  }
}

describe(`decoder fuzzing (fast-check, ${RUNS} mutated files per format)`, () => {
  for (const [name, base] of Object.entries(valid)) {
    it(`${name}: decodes or throws CodecError`, () => {
      decodeOrTypedError(name, base);
      fc.assert(fc.property(mutation, (m) => decodeOrTypedError(name, mutate(base, m))), { numRuns: RUNS, ...(SEED !== undefined ? { seed: SEED } : {}) });
    }, 120_000);
  }
});
