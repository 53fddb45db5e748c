import { describe, expect, it } from 'vitest';
import { getFloat16, setFloat16 } from '@petamoriken/float16';
import {
  binary16ToFloat32, decodeB10g11r11, decodeRgb9e5, encodeB10g11r11, encodeRgb9e5, float32ToBinary16, floorLog2,
} from '@lightkiln/math';

describe('binary16 (IEEE 754-2008 binary16)', () => {
  it('encodes the reference bit patterns', () => {
    const cases: [number, number][] = [
      [1, 0x3c00], [0.5, 0x3800], [-2, 0xc000], [65504, 0x7bff], [2 ** -14, 0x0400], [2 ** -24, 0x0001],
      [Infinity, 0x7c00], [-0, 0x8000], [0.1, 0x2e66], [1 / 3, 0x3555], [Math.PI, 0x4248], [65520, 0x7c00],
      [-Infinity, 0xfc00], [0, 0],
    ];
    for (const [value, bits] of cases) expect(float32ToBinary16(value), `${value}`).toBe(bits);
    expect(float32ToBinary16(NaN) & 0x7c00).toBe(0x7c00);
    expect(binary16ToFloat32(0x2e66)).toBeCloseTo(0.0999756, 7);
    expect(Number.isNaN(binary16ToFloat32(0x7e00))).toBe(true);
  });

  it('agrees with @petamoriken/float16 over a dense float32 sweep (reference library)', () => {
    const view = new DataView(new ArrayBuffer(4));
    const f32 = new Float32Array(1);
    const u32 = new Uint32Array(f32.buffer);
    let mismatches = 0;
    for (let bits = 0; bits < 0x80000000; bits += 0x1f1) {
      u32[0] = bits;
      const value = f32[0]!;
      if (Number.isNaN(value)) continue;
      setFloat16(view, 0, value);
      const ref = view.getUint16(0);
      if (float32ToBinary16(value) !== ref || float32ToBinary16(-value) !== (ref | 0x8000)) mismatches++;
    }
    expect(mismatches).toBe(0);
    for (let h = 0; h < 0x7c00; h++) {
      view.setUint16(0, h);
      expect(binary16ToFloat32(h)).toBe(getFloat16(view, 0));
      expect(float32ToBinary16(binary16ToFloat32(h))).toBe(h);
    }
  });
});

describe('E5B9G9R9 (Khronos Data Format spec 1.3 sec. 10.4)', () => {
  it('encodes the reference values', () => {
    expect(encodeRgb9e5(1, 1, 1)).toBe(0x84020100);
    expect(encodeRgb9e5(1, 0.5, 0.25)).toBe(0x81010100);
    expect(encodeRgb9e5(0.1, 0.2, 0.3)).toBe(0x74cd9a66);
    expect(encodeRgb9e5(1e6, 0, 0)).toBe(0xf80001ff);
    expect(encodeRgb9e5(2 ** -24, 0, 0)).toBe(0x00000001);
    const out = new Float64Array(3);
    decodeRgb9e5(out, 0, 0x74cd9a66);
    expect(out[0]).toBeCloseTo(0.099609, 6);
    expect(out[1]).toBeCloseTo(0.200195, 6);
    expect(out[2]).toBeCloseTo(0.299805, 6);
  });

  it('round-trips within half a step of the shared exponent', () => {
    const out = new Float64Array(3);
    let state = 1;
    for (let i = 0; i < 20000; i++) {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
      const scale = Math.pow(2, (state % 34) - 20); // stays below the 65408 clamp
      const r = ((state >>> 8) % 1000) / 1000 * scale;
      const g = ((state >>> 4) % 997) / 997 * scale;
      const b = ((state >>> 12) % 991) / 991 * scale;
      const packed = encodeRgb9e5(r, g, b);
      decodeRgb9e5(out, 0, packed);
      const step = Math.pow(2, (packed >>> 27) - 24);
      expect(Math.abs(out[0]! - r)).toBeLessThanOrEqual(step / 2 + 1e-18);
      expect(Math.abs(out[1]! - g)).toBeLessThanOrEqual(step / 2 + 1e-18);
      expect(Math.abs(out[2]! - b)).toBeLessThanOrEqual(step / 2 + 1e-18);
    }
  });
});

describe('B10G11R11 (Khronos Data Format spec 1.3 sec. 10.3)', () => {
  it('encodes the reference values', () => {
    expect(encodeB10g11r11(1, 0, 0)).toBe(0x3c0);
    expect(encodeB10g11r11(0, 0, 1) >>> 22).toBe(0x1e0);
    expect(encodeB10g11r11(0.1, 0, 0)).toBe(0x2e6);
    expect(encodeB10g11r11(0, 0, 0.1) >>> 22).toBe(0x173);
    expect(encodeB10g11r11(1, 1, 1)).toBe(0x781e03c0);
    expect(encodeB10g11r11(1, 0.5, 0.25)).toBe(0x681c03c0);
    expect(encodeB10g11r11(0.1, 0.2, 0.3)).toBe(0x699932e6);
    const out = new Float64Array(3);
    decodeB10g11r11(out, 0, encodeB10g11r11(1e9, -5, 1e9));
    expect([...out]).toEqual([65024, 0, 64512]);
  });

  it('round-trips within half an ulp (relative 2^-7 for R/G, 2^-6 for B) in the normal range', () => {
    const out = new Float64Array(3);
    for (let i = 0; i < 5000; i++) {
      const v = Math.pow(2, -14 + (i / 5000) * 29);
      decodeB10g11r11(out, 0, encodeB10g11r11(v, v, v));
      expect(Math.abs(out[0]! - v) / v).toBeLessThanOrEqual(2 ** -7);
      expect(Math.abs(out[2]! - v) / v).toBeLessThanOrEqual(2 ** -6);
    }
  });

  it('floorLog2 is exact at powers of two and in the binary64 subnormal range', () => {
    expect(floorLog2(1)).toBe(0);
    expect(floorLog2(0.999999)).toBe(-1);
    expect(floorLog2(2 ** -1070)).toBe(-1070);
  });
});
