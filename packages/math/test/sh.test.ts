import { describe, expect, it } from 'vitest';
import {
  accumulateSh9, applySh9BandWeights, convolveSh9Lambert, evalSh9Basis, evalSh9Rgb, SH_LAMBERT_BAND, sh9WindowWeights,
} from '@lightkiln/math';
import { integrateSphere } from '../../../test/helpers/quadrature.js';

/** Projects radiance f(d) onto SH9 by quadrature (grey, all channels equal). */
function project(f: (x: number, y: number, z: number) => number): Float64Array {
  const coeffs = new Float64Array(27);
  const basis = new Float64Array(9);
  for (let k = 0; k < 9; k++) {
    const value = integrateSphere((x, y, z) => {
      evalSh9Basis(basis, 0, x, y, z);
      return f(x, y, z) * basis[k]!;
    }, 64, 64);
    coeffs[3 * k] = value; coeffs[3 * k + 1] = value; coeffs[3 * k + 2] = value;
  }
  return coeffs;
}

function irradianceAt(radiance: Float64Array, x: number, y: number, z: number): number {
  const irr = new Float64Array(27);
  convolveSh9Lambert(irr, radiance);
  const out = new Float64Array(3);
  evalSh9Rgb(out, 0, irr, x, y, z);
  return out[0]!;
}

describe('SH9 basis (Ramamoorthi & Hanrahan 2001, eq. 3)', () => {
  it('has the published constants', () => {
    const b = new Float64Array(9);
    evalSh9Basis(b, 0, 0, 0, 1);
    expect(b[0]).toBeCloseTo(0.2820948, 7); // 1/(2 sqrt(pi))
    expect(b[2]).toBeCloseTo(0.4886025, 7); // sqrt(3/(4 pi)) z
    expect(b[6]).toBeCloseTo(2 * 0.315392, 5);
    evalSh9Basis(b, 0, Math.SQRT1_2, Math.SQRT1_2, 0);
    expect(b[4]).toBeCloseTo(1.092548 * 0.5, 6);
    expect(b[8]).toBeCloseTo(0, 12);
    expect(b[1]).toBeCloseTo(0.488603 * Math.SQRT1_2, 6);
  });

  it('is orthonormal over the sphere', () => {
    const bi = new Float64Array(9);
    for (let i = 0; i < 9; i++) {
      for (let j = i; j < 9; j++) {
        const v = integrateSphere((x, y, z) => {
          evalSh9Basis(bi, 0, x, y, z);
          return bi[i]! * bi[j]!;
        }, 24, 24);
        expect(v).toBeCloseTo(i === j ? 1 : 0, 8);
      }
    }
  });

  it('has Lambert band weights pi, 2pi/3, pi/4 (Ramamoorthi & Hanrahan 2001)', () => {
    expect([...SH_LAMBERT_BAND]).toEqual([Math.PI, (2 * Math.PI) / 3, Math.PI / 4]);
  });
});

describe('SH9 irradiance (published check values)', () => {
  it('constant radiance 1 gives E = pi everywhere', () => {
    const c = project(() => 1);
    expect(irradianceAt(c, 0, 0, 1)).toBeCloseTo(Math.PI, 8);
    expect(irradianceAt(c, 0.6, -0.8, 0)).toBeCloseTo(Math.PI, 8);
  });

  it('linear radiance 1 + w.z is exact in SH9', () => {
    const c = project((_x, _y, z) => 1 + z);
    expect(irradianceAt(c, 0, 0, 1)).toBeCloseTo(5.235988, 6);
    expect(irradianceAt(c, 1, 0, 0)).toBeCloseTo(Math.PI, 6);
    expect(irradianceAt(c, 0, 0, -1)).toBeCloseTo(1.047198, 6);
  });

  it('clamped cosine radiance gives the published SH9 values, negative behind', () => {
    const c = project((_x, _y, z) => Math.max(0, z));
    const expected = [2.078033, 1.278317, 0.66268, 0.23112, -0.016362];
    [0, 60, 90, 120, 180].forEach((deg, k) => {
      const g = (deg * Math.PI) / 180;
      expect(irradianceAt(c, Math.sin(g), 0, Math.cos(g))).toBeCloseTo(expected[k]!, 3);
    });
  });

  it('a unit-power delta light gives 1.0625, 0.09375, 0.0625', () => {
    const radiance = new Float64Array(27);
    accumulateSh9(radiance, 0, 0, 1, 1, 1, 1, 1);
    expect(irradianceAt(radiance, 0, 0, 1)).toBeCloseTo(1.0625, 6);
    expect(irradianceAt(radiance, 1, 0, 0)).toBeCloseTo(0.09375, 6);
    expect(irradianceAt(radiance, 0, 0, -1)).toBeCloseTo(0.0625, 6);
  });

  it('a Hann window keeps clamped-cosine irradiance non-negative (Sloan 2008 test idea)', () => {
    const c = project((_x, _y, z) => Math.max(0, z));
    const w = new Float64Array(3);
    sh9WindowWeights(w, 'hann', 3);
    expect(w[0]).toBe(1);
    applySh9BandWeights(c, w);
    for (let deg = 0; deg <= 180; deg += 5) {
      const g = (deg * Math.PI) / 180;
      expect(irradianceAt(c, Math.sin(g), 0, Math.cos(g))).toBeGreaterThanOrEqual(0);
    }
    sh9WindowWeights(w, 'lanczos', 3);
    expect(w[1]).toBeCloseTo(Math.sin(Math.PI / 3) / (Math.PI / 3), 14);
    sh9WindowWeights(w, 'none', 3);
    expect([...w]).toEqual([1, 1, 1]);
  });
});
