import { describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import { read as readKtx2 } from 'ktx-parse';
import { unzlibSync } from 'fflate';
import {
  buildDfd, crc32, decodeKtx2, encodeKtx2, encodePng, linearToSrgb, packRgbd, packRgbm, packRgbTexels, packTexels, toneMapToSrgb8,
  unpackRgbd, unpackRgbm, type FloatImage, type Ktx2Format, type PngFilterChoice,
} from '@lightkiln/codecs';

describe('PNG writer (W3C PNG / ISO/IEC 15948)', () => {
  it('computes the standard CRC-32 check values', () => {
    expect(crc32(new TextEncoder().encode('123456789'))).toBe(0xcbf43926);
    expect(crc32(Uint8Array.from([...'IHDR'].map((c) => c.charCodeAt(0)).concat([0, 0, 0, 1, 0, 0, 0, 1, 8, 6, 0, 0, 0])))).toBe(0x1f15c489);
    expect(crc32(new TextEncoder().encode('IEND'))).toBe(0xae426082);
  });

  it('writes the minimal 1x1 RGBA file in 70 bytes', () => {
    expect(encodePng({ width: 1, height: 1, channels: 4, data: Uint8Array.of(1, 2, 3, 4) }).length).toBe(70);
  });

  for (const filter of ['none', 'sub', 'up', 'average', 'paeth', 'adaptive'] as PngFilterChoice[]) {
    it(`is decoded bit-exactly by pngjs with filter ${filter}`, () => {
      for (const channels of [3, 4]) {
        const width = 23;
        const height = 11;
        const data = new Uint8Array(width * height * channels);
        for (let i = 0; i < data.length; i++) data[i] = (i * 37 + (i >> 5) * 11) & 0xff;
        const png = PNG.sync.read(Buffer.from(encodePng({ width, height, channels, data }, { filter, text: { Software: 'lightkiln' } })));
        expect([png.width, png.height]).toEqual([width, height]);
        for (let p = 0; p < width * height; p++) {
          for (let c = 0; c < channels; c++) expect(png.data[p * 4 + c]).toBe(data[p * channels + c]);
          if (channels === 3) expect(png.data[p * 4 + 3]).toBe(255);
        }
      }
    });
  }

  it('encodes sRGB per IEC 61966-2-1 and tone maps with Reinhard c/(1+c)', () => {
    expect(linearToSrgb(0.0031308)).toBeCloseTo(12.92 * 0.0031308, 9);
    expect(linearToSrgb(0.0031309)).toBeCloseTo(0.04045, 5); // the two pieces meet at the threshold
    expect(linearToSrgb(0.5)).toBeCloseTo(0.7353570, 6);
    expect(linearToSrgb(1)).toBe(1);
    const image: FloatImage = { width: 2, height: 1, channels: 3, data: Float32Array.of(1, 1, 1, 0, 0, 0) };
    const out = toneMapToSrgb8(image);
    expect(out.data[0]).toBe(Math.round(linearToSrgb(0.5) * 255));
    expect(out.data[3]).toBe(0);
    expect(toneMapToSrgb8(image, { exposureEv: 1, curve: 'clamp' }).data[0]).toBe(255);
  });

  it('round-trips RGBM (range 8) and RGBD (range 64) within their quantisation', () => {
    const data = new Float32Array(3 * 200);
    for (let i = 0; i < data.length; i++) data[i] = Math.pow(2, ((i * 7) % 100) / 100 * 12 - 7);
    const image: FloatImage = { width: 200, height: 1, channels: 3, data };
    const m = unpackRgbm(packRgbm(image, 8), 8);
    const d = unpackRgbd(packRgbd(image, 64));
    for (let p = 0; p < 200; p++) {
      const maxc = Math.max(data[p * 3]!, data[p * 3 + 1]!, data[p * 3 + 2]!);
      for (let c = 0; c < 3; c++) {
        const v = data[p * 3 + c]!;
        // RGBM: one 8-bit step of the colour times the multiplier a M, a <= max/M + 1/255.
        expect(Math.abs(m.data[p * 3 + c]! - Math.min(v, 8))).toBeLessThanOrEqual((0.5 / 255) * (maxc + 8 / 255) * 1.0001 + 1e-7);
        if (maxc <= 64) expect(Math.abs(d.data[p * 3 + c]! - v)).toBeLessThanOrEqual((0.5 / 255) / (Math.min(Math.floor(Math.max(64 / maxc, 1)), 255) / 255) + 1e-6);
      }
    }
  });
});

function cube(format: Ktx2Format, size: number, levels: number): Float32Array[] {
  const channels = format === 'rg16f' ? 2 : format === 'rgba16f' || format === 'rgba32f' ? 4 : 3;
  return Array.from({ length: levels }, (_, l) => {
    const n = Math.max(1, size >> l);
    const data = new Float32Array(n * n * 6 * channels);
    for (let i = 0; i < data.length; i++) data[i] = ((i * 13 + l * 7) % 97) / 16;
    return data;
  });
}

describe('KTX 2.0 (Khronos KTX 2.0 spec; DF spec 1.3)', () => {
  it('lays out a 4x4 RGBA16F cube with 3 levels exactly as the spec rules give', () => {
    const bytes = encodeKtx2({ format: 'rgba16f', width: 4, height: 4, faceCount: 6, levels: cube('rgba16f', 4, 3), writer: '' });
    const v = new DataView(bytes.buffer, bytes.byteOffset);
    expect(bytes.length).toBe(1280);
    expect(v.getUint32(48, true)).toBe(152); // DFD
    expect(v.getUint32(56, true)).toBe(244); // KVD
    expect(v.getUint32(60, true)).toBe(24);
    expect(Number(v.getBigUint64(80 + 2 * 24, true))).toBe(272);
    expect(Number(v.getBigUint64(88 + 2 * 24, true))).toBe(48);
    expect(Number(v.getBigUint64(80 + 24, true))).toBe(320);
    expect(Number(v.getBigUint64(88 + 24, true))).toBe(192);
    expect(Number(v.getBigUint64(80, true))).toBe(512);
    expect(Number(v.getBigUint64(88, true))).toBe(768);
  });

  it('packs RGB texels straight to the format: alpha 1, clamped to the largest finite value, as packTexels on RGBA', () => {
    const rgb = new Float32Array([0, 0.5, 1, 7e4, 2, 3, 1e-3, 9e9, 65504, 1, 2, 1e6]);
    // Largest finite binary16 (IEEE 754-2008): 65504 = 0x7bff; 1.0 = 0x3c00.
    const cases: [Ktx2Format, [number, number, number]][] = [['rgba16f', [65504, 65504, 65504]], ['rgba32f', [3.4e38, 3.4e38, 3.4e38]], ['rgb9e5', [65408, 65408, 65408]], ['b10g11r11', [65024, 65024, 64512]]];
    for (const [format, max] of cases) {
      const { bytes, clamped } = packRgbTexels(format, rgb, max);
      const channels = format.startsWith('rgba') ? 4 : 3;
      const expanded = new Float32Array(4 * channels);
      for (let t = 0; t < 4; t++) {
        for (let c = 0; c < 3; c++) expanded[t * channels + c] = Math.min(rgb[t * 3 + c]!, max[c]!);
        if (channels === 4) expanded[t * 4 + 3] = 1;
      }
      expect(bytes).toEqual(packTexels(format, expanded, 4));
      expect(clamped).toBe(format === 'rgba32f' ? 0 : 3);
    }
    const half = new DataView(packRgbTexels('rgba16f', rgb, [65504, 65504, 65504]).bytes.buffer);
    expect(half.getUint16(6, true)).toBe(0x3c00);
    expect(half.getUint16(8, true)).toBe(0x7bff);
  });

  it('writes the same file from levels that pack themselves as from packed levels, read back by ktx-parse (registry reference reader)', () => {
    const levels = [new Float32Array(6 * 4 * 4 * 3), new Float32Array(6 * 2 * 2 * 3), new Float32Array(6 * 3)];
    levels.forEach((l, m) => { for (let i = 0; i < l.length; i++) l[i] = ((i * 37 + m * 11) % 97) / 7 - 2; });
    const max: [number, number, number] = [65504, 65504, 65504];
    for (const supercompression of ['none', 'zlib'] as const) {
      const packed = levels.map((l) => packRgbTexels('rgba16f', l, max).bytes);
      const reference = encodeKtx2({ format: 'rgba16f', width: 4, height: 4, faceCount: 6, levels: packed, supercompression });
      let calls = 0;
      const packers = levels.map((l) => ({ byteLength: (l.length / 3) * 8, pack: (target: Uint8Array) => { calls++; packRgbTexels('rgba16f', l, max, target); } }));
      const bytes = encodeKtx2({ format: 'rgba16f', width: 4, height: 4, faceCount: 6, levels: packers, supercompression });
      expect(bytes).toEqual(reference);
      expect(calls).toBe(3);
      const parsed = readKtx2(bytes);
      expect(parsed.levels.length).toBe(3);
      expect(parsed.supercompressionScheme).toBe(supercompression === 'zlib' ? 3 : 0);
    }
    // A packer whose length is not the level's is refused before anything is written.
    const wrong = { byteLength: 8, pack: () => { throw new Error('not reached'); } };
    expect(() => encodeKtx2({ format: 'rgba16f', width: 4, height: 4, faceCount: 6, levels: [wrong], supercompression: 'none' })).toThrow(/packed level 0 holds 8 bytes, expected 768/);
    expect(() => packRgbTexels('rgba16f', levels[2]!, max, new Uint8Array(5))).toThrow(/target holds 5 bytes/);
  });

  it('writes the reference DFD words for every format', () => {
    const hex = (a: Uint32Array): string[] => [...a].map((w) => w.toString(16).padStart(8, '0'));
    const rgba16 = buildDfd('rgba16f');
    expect(rgba16[0]).toBe(92);
    expect(rgba16[2]! >>> 16).toBe(88);
    expect(rgba16[3]).toBe(0x00010101);
    expect(rgba16[5]).toBe(8);
    expect([rgba16[7], rgba16[11], rgba16[15], rgba16[19]].map((w) => w!.toString(16))).toEqual(['c00f0000', 'c10f0010', 'c20f0020', 'cf0f0030']);
    expect([rgba16[9], rgba16[10]]).toEqual([0xbf800000, 0x3f800000]);
    const rg16 = buildDfd('rg16f');
    expect([rg16[0], rg16[2]! >>> 16, rg16[5]]).toEqual([60, 56, 4]);
    const rgba32 = buildDfd('rgba32f');
    expect([rgba32[0], rgba32[5]]).toEqual([92, 16]);
    expect(hex(Uint32Array.of(rgba32[7]!, rgba32[11]!, rgba32[15]!, rgba32[19]!))).toEqual(['c01f0000', 'c11f0020', 'c21f0040', 'cf1f0060']);
    const b10 = buildDfd('b10g11r11');
    expect([b10[0], b10[2]! >>> 16, b10[5]]).toEqual([76, 72, 4]);
    expect(hex(Uint32Array.of(b10[7]!, b10[11]!, b10[15]!))).toEqual(['800a0000', '810a000b', '82090016']);
    expect([b10[9], b10[10]]).toEqual([0, 0x3f800000]);
    const e5 = buildDfd('rgb9e5');
    expect([e5[0], e5[2]! >>> 16, e5[5]]).toEqual([124, 120, 4]);
    expect(hex(Uint32Array.of(e5[7]!, e5[11]!, e5[15]!, e5[19]!, e5[23]!, e5[27]!))).toEqual(['00080000', '2004001b', '01080009', '2104001b', '02080012', '2204001b']);
    expect([e5[9], e5[10], e5[13], e5[14]]).toEqual([0, 8448, 15, 31]);
  });

  const formats: [Ktx2Format, number, number][] = [['rgba16f', 97, 2], ['rgba32f', 109, 4], ['rgb9e5', 123, 4], ['b10g11r11', 122, 4], ['rg16f', 83, 2]];
  for (const [format, vkFormat, typeSize] of formats) {
    for (const supercompression of ['none', 'zlib'] as const) {
      it(`${format} ${supercompression}: ktx-parse reads what we wrote; our reader round-trips it`, () => {
        const faceCount = format === 'rg16f' ? 1 : 6;
        const levels = faceCount === 6 ? cube(format, 16, 5) : [new Float32Array(32 * 8 * 2).map((_, i) => (i % 50) / 50)];
        const width = faceCount === 6 ? 16 : 32;
        const height = faceCount === 6 ? 16 : 8;
        const bytes = encodeKtx2({ format, width, height, faceCount, levels, supercompression, keyValues: { 'lightkiln.roughness': '[0,0.25,0.5,0.75,1]' } });
        const container = readKtx2(bytes);
        expect(container.vkFormat).toBe(vkFormat);
        expect(container.typeSize).toBe(typeSize);
        expect([container.pixelWidth, container.pixelHeight, container.pixelDepth, container.layerCount]).toEqual([width, height, 0, 0]);
        expect(container.faceCount).toBe(faceCount);
        expect(container.levels.length).toBe(levels.length);
        expect(container.supercompressionScheme).toBe(supercompression === 'zlib' ? 3 : 0);
        const writer = container.keyValue['KTXwriter'];
        expect(typeof writer === 'string' ? writer : new TextDecoder().decode(writer as Uint8Array)).toMatch(/^lightkiln/);
        expect(container.keyValue['KTXorientation']).toBe('rd');
        const dfd = container.dataFormatDescriptor[0]!;
        expect(dfd.colorModel).toBe(1);
        expect(dfd.transferFunction).toBe(1);
        expect(dfd.colorPrimaries).toBe(1);
        expect(dfd.bytesPlane[0]).toBe(ktxBytes(format));
        container.levels.forEach((level, l) => {
          const raw = supercompression === 'zlib' ? unzlibSync(level.levelData) : level.levelData;
          const n = faceCount === 6 ? Math.max(1, 16 >> l) ** 2 * 6 : 32 * 8;
          expect(level.uncompressedByteLength).toBe(n * ktxBytes(format));
          expect([...raw]).toEqual([...packTexels(format, levels[l]!, n)]);
        });
        const ours = decodeKtx2(bytes);
        expect(ours.levels.length).toBe(levels.length);
        expect(ours.keyValues.get('lightkiln.roughness')).toBe('[0,0.25,0.5,0.75,1]');
        ours.levels.forEach((level, l) => {
          const expected = levels[l]!;
          for (let i = 0; i < expected.length; i++) expect(Math.abs(level.data[i]! - expected[i]!)).toBeLessThanOrEqual(Math.abs(expected[i]!) * 2 ** -5 + 2 ** -14);
        });
      });
    }
  }
});

function ktxBytes(format: Ktx2Format): number {
  return format === 'rgba16f' ? 8 : format === 'rgba32f' ? 16 : 4;
}
