import { describe, expect, it } from 'vitest';
import {
  alphaFromPerceptualRoughness, createGgxHalfVectorSet, dfgAverageAlbedo, integrateClothAlbedo, integrateDfg, integrateDfgExact,
  multipleScatteringAlbedo, turquinCompensation,
} from '@lightkiln/math';

function dfg(mu: number, perceptualRoughness: number, samples = 16384): [number, number] {
  const alpha = alphaFromPerceptualRoughness(perceptualRoughness);
  const out = new Float64Array(2);
  integrateDfg(out, 0, mu, alpha, createGgxHalfVectorSet(alpha, samples));
  return [out[0]!, out[1]!];
}

// Check values of an independent Gauss-Legendre quadrature of the same integrals (height-correlated
// Smith GGX, f90 = 1), rounded to 4 decimals.
const MUS = [0.1, 0.25, 0.5, 0.75, 1];
const TABLE_A: Record<string, number[]> = {
  '0.1': [0.4158, 0.7629, 0.9683, 0.9989, 0.9999],
  '0.25': [0.5051, 0.758, 0.9557, 0.9923, 0.9957],
  '0.5': [0.7519, 0.7593, 0.8349, 0.8888, 0.9158],
  '0.75': [0.7958, 0.7165, 0.6547, 0.6312, 0.6268],
  '1': [0.7363, 0.5868, 0.4477, 0.3639, 0.3068],
};
const TABLE_B: Record<string, number[]> = {
  '0.1': [0.5784, 0.2362, 0.0314, 0.001, 0],
  '0.25': [0.3916, 0.2035, 0.0326, 0.0015, 0],
  '0.5': [0.1397, 0.0808, 0.0223, 0.0027, 0],
  '0.75': [0.0526, 0.0279, 0.0085, 0.0016, 0],
  '1': [0.0239, 0.0109, 0.003, 0.0006, 0],
};

describe('DFG terms (Karis 2013 split sum; check values of an independent quadrature)', () => {
  for (const pr of Object.keys(TABLE_A)) {
    it(`matches the quadrature table within 0.003 at perceptual roughness ${pr}`, () => {
      MUS.forEach((mu, k) => {
        const [a, b] = dfg(mu, Number(pr));
        expect(Math.abs(a - TABLE_A[pr]![k]!), `A(${pr}, ${mu}) = ${a}`).toBeLessThan(0.003);
        expect(Math.abs(b - TABLE_B[pr]![k]!), `B(${pr}, ${mu}) = ${b}`).toBeLessThan(0.003);
      });
    });
  }

  it('matches the extra-digit values to 1e-3', () => {
    expect(dfg(1, 0.5)[0]).toBeCloseTo(0.9157851, 3);
    expect(dfg(0.1, 1)[0]).toBeCloseTo(0.7363436, 3);
    expect(dfg(0.25, 0.25)[1]).toBeCloseTo(0.2035357, 3);
    expect(dfg(0.25, 0.75)[1]).toBeCloseTo(0.0279483, 3);
  });

  it('tends to A = 1 - (1 - mu)^5, B = (1 - mu)^5 as roughness -> 0 (derived)', () => {
    for (const mu of [0.2, 0.5, 0.9]) {
      const [a, b] = dfg(mu, 0.02, 4096);
      expect(a).toBeCloseTo(1 - (1 - mu) ** 5, 4);
      expect(b).toBeCloseTo((1 - mu) ** 5, 4);
    }
  });

  it('gives E = 1 - ln 2 at alpha = 1, mu = 1 (exact)', () => {
    const [a, b] = dfg(1, 1, 65536);
    expect(a + b).toBeCloseTo(1 - Math.LN2, 3);
  });

  it('rejects the separable Smith k = alpha/2 variant (wrong-G detector)', () => {
    const [a] = dfg(0.5, 0.5);
    expect(Math.abs(a - 0.7285)).toBeGreaterThan(0.05);
  });

  it('averages E over mu: E_avg(pr 0.5) = 0.8823 (published check values)', () => {
    const alpha = alphaFromPerceptualRoughness(0.5);
    expect(dfgAverageAlbedo(alpha, createGgxHalfVectorSet(alpha, 4096), 64)).toBeCloseTo(0.8823, 2);
    const alpha1 = alphaFromPerceptualRoughness(1);
    expect(dfgAverageAlbedo(alpha1, createGgxHalfVectorSet(alpha1, 4096), 64)).toBeCloseTo(0.4091, 2);
  });
});

describe('multiple scattering (published check values)', () => {
  it('conserves energy at F0 = 1 for Fdez-Aguera 2019 and Turquin 2019', () => {
    for (const pr of [0.25, 0.5, 1]) {
      const [a, b] = dfg(0.5, pr, 4096);
      expect(multipleScatteringAlbedo(1, a, b)).toBeCloseTo(1, 12);
      expect((a + b) * turquinCompensation(1, a, b)).toBeCloseTo(1, 12);
    }
  });

  it('matches the F0 = 0.04, mu = 0.5 check values', () => {
    const [a5, b5] = dfg(0.5, 0.5);
    expect(0.04 * a5 + b5).toBeCloseTo(0.0557, 3);
    expect(multipleScatteringAlbedo(0.04, a5, b5)).toBeCloseTo(0.0564, 3);
    expect((0.04 * a5 + b5) * turquinCompensation(0.04, a5, b5)).toBeCloseTo(0.0561, 3);
    const [a1, b1] = dfg(0.5, 1);
    expect(0.04 * a1 + b1).toBeCloseTo(0.0209, 3);
    expect(multipleScatteringAlbedo(0.04, a1, b1)).toBeCloseTo(0.0219, 3);
  });
});

describe('cloth albedo (Estevez & Kulla 2017 D, Neubelt & Pettineo 2013 V)', () => {
  it('is positive, below 1, and converged in the sample count', () => {
    for (const mu of [0.1, 0.5, 1]) {
      const coarse = integrateClothAlbedo(mu, 0.25, 4096);
      const fine = integrateClothAlbedo(mu, 0.25, 65536);
      expect(fine).toBeGreaterThan(0);
      expect(fine).toBeLessThan(1);
      expect(Math.abs(coarse - fine)).toBeLessThan(2e-3);
    }
  });
});

/**
 * An independent brute-force quadrature of A and B, for the checks below: midpoint rule over theta_h
 * (through theta_h = atan(alpha tan x), x uniform, which spreads the points over the GGX peak) and phi_h in
 * [0, pi], GGX D written out (Walter et al. 2007), dl = 4 (v.h) dh, points with n.l <= 0 dropped.
 */
function bruteDfg(mu: number, alpha: number, nTheta = 3000, nPhi = 2000): [number, number] {
  const a2 = alpha * alpha;
  const sinV = Math.sqrt(1 - mu * mu);
  const lambda = (c: number): number => 0.5 * (-1 + Math.sqrt(1 + (a2 * (1 - c * c)) / (c * c)));
  let A = 0;
  let B = 0;
  for (let i = 0; i < nTheta; i++) {
    const x = ((i + 0.5) / nTheta) * (Math.PI / 2);
    const th = Math.atan(alpha * Math.tan(x));
    const dth = (alpha / Math.cos(x) ** 2 / (1 + (alpha * Math.tan(x)) ** 2)) * (Math.PI / 2 / nTheta);
    const ch = Math.cos(th);
    const sh = Math.sin(th);
    const d = a2 / (Math.PI * (ch * ch * (a2 - 1) + 1) ** 2);
    for (let j = 0; j < nPhi; j++) {
      const p = ((j + 0.5) / nPhi) * Math.PI;
      const vh = sinV * sh * Math.cos(p) + mu * ch;
      const nl = 2 * vh * ch - mu;
      if (nl <= 0 || vh <= 0) continue;
      // f (n.l) dl = D G2 / (4 n.v) * 4 (v.h) dh
      const f = (d * vh) / ((1 + lambda(mu) + lambda(nl)) * mu);
      const fc = (1 - vh) ** 5;
      const dw = sh * dth * (Math.PI / nPhi) * 2;
      A += f * (1 - fc) * dw;
      B += f * fc * dw;
    }
  }
  return [A, B];
}

describe('the deterministic DFG quadrature (math/dfg-exact.ts)', () => {
  const out = new Float64Array(2);
  const scratch = new Float64Array(2);
  it('matches the independent check values to their rounding (5e-5 + 1e-5)', () => {
    for (const pr of Object.keys(TABLE_A)) {
      MUS.forEach((mu, k) => {
        integrateDfgExact(out, 0, mu, alphaFromPerceptualRoughness(Number(pr)), scratch);
        expect(Math.abs(out[0]! - TABLE_A[pr]![k]!), `A(${pr}, ${mu})`).toBeLessThan(6e-5);
        expect(Math.abs(out[1]! - TABLE_B[pr]![k]!), `B(${pr}, ${mu})`).toBeLessThan(6e-5);
      });
    }
  });

  it('agrees with a brute-force quadrature within 1e-4 down to n.v = 0.5/128 and r = 0.5/128', () => {
    for (const [mu, r] of [[0.5 / 128, 0.5 / 128], [0.5 / 128, 0.2], [0.5 / 128, 0.6], [0.5 / 128, 1], [1.5 / 128, 0.1], [0.3, 0.02], [0.9, 0.05]] as const) {
      const alpha = alphaFromPerceptualRoughness(r);
      integrateDfgExact(out, 0, mu, alpha, scratch);
      const [a, b] = bruteDfg(mu, alpha);
      expect(Math.abs(out[0]! - a), `A(${mu}, ${r})`).toBeLessThan(1e-4);
      expect(Math.abs(out[1]! - b), `B(${mu}, ${r})`).toBeLessThan(1e-4);
    }
  });

  it('reaches the mirror limit A = 1 - (1 - n.v)^5, B = (1 - n.v)^5 as r -> 0 (Schlick 1994 at h = n)', () => {
    for (const mu of [0.1, 0.3, 0.6, 1]) {
      integrateDfgExact(out, 0, mu, alphaFromPerceptualRoughness(0.01), scratch);
      expect(out[0]!).toBeCloseTo(1 - (1 - mu) ** 5, 5);
      expect(out[1]!).toBeCloseTo((1 - mu) ** 5, 5);
    }
  });
});
