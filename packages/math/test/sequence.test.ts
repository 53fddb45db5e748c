import { describe, expect, it } from 'vitest';
import { hammersleyPoint, radicalInverseBase2, reverseBits32, rotateUnit, rotationOffsetsForSeed } from '@lightkiln/math';

describe('radical inverse base 2', () => {
  it('matches the van der Corput sequence (computed)', () => {
    const expected = [0, 0.5, 0.25, 0.75, 0.125, 0.625, 0.375, 0.875, 0.0625];
    expected.forEach((v, i) => expect(radicalInverseBase2(i)).toBe(v));
    expect(radicalInverseBase2(1000)).toBe(0.0927734375);
    expect(radicalInverseBase2(12345)).toBe(0.60955810546875);
  });

  it('reverses 32 bits as unsigned (published check values)', () => {
    expect(reverseBits32(1)).toBe(0x80000000);
    expect(reverseBits32(3)).toBe(0xc0000000);
    expect(reverseBits32(0xffffffff)).toBe(0xffffffff);
    expect(radicalInverseBase2(0xffffffff)).toBeLessThan(1);
  });

  it('gives the 8-point Hammersley set (published check values)', () => {
    const expected = [[0, 0], [0.125, 0.5], [0.25, 0.25], [0.375, 0.75], [0.5, 0.125], [0.625, 0.625], [0.75, 0.375], [0.875, 0.875]];
    const out = new Float64Array(2);
    expected.forEach(([u1, u2], i) => {
      hammersleyPoint(out, 0, i, 8);
      expect([out[0], out[1]]).toEqual([u1, u2]);
    });
  });

  it('rotates deterministically, seed 0 meaning none (Cranley & Patterson 1976)', () => {
    const a = new Float64Array(2);
    const b = new Float64Array(2);
    rotationOffsetsForSeed(a, 0, 0);
    expect([...a]).toEqual([0, 0]);
    rotationOffsetsForSeed(a, 0, 7);
    rotationOffsetsForSeed(b, 0, 7);
    expect([...a]).toEqual([...b]);
    expect(a[0]).toBeGreaterThan(0);
    rotationOffsetsForSeed(b, 0, 8);
    expect(b[0]).not.toBe(a[0]);
    expect(rotateUnit(0.75, 0.5)).toBe(0.25);
    expect(rotateUnit(0.25, 0.5)).toBe(0.75);
  });
});
