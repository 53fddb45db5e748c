import { describe, expect, it } from 'vitest';
import {
  alphaFromPerceptualRoughness, buildOrthonormalBasis, ggxD, ggxHalfVectorPdf, ggxReflectedPdf, ggxVndfPdf,
  invertGgxHalfVectorSample, radicalInverseBase2, sampleGgxHalfVector, sampleGgxVndf, smithG1,
  smithG2HeightCorrelated, smithLambda, smithVisibilityHeightCorrelated, charlieD,
} from '@lightkiln/math';
import { integrateHemisphere } from '../../../test/helpers/quadrature.js';
import { chi2SphereTest } from '../../../test/helpers/chi2.js';

describe('GGX distribution', () => {
  it('has D(n.h = 1) = 1/(pi alpha^2) (Walter et al. 2007)', () => {
    expect(ggxD(1, 0.25)).toBeCloseTo(5.092958, 5);
    expect(ggxD(1, 1)).toBeCloseTo(1 / Math.PI, 12);
    expect(ggxD(0, 0.5)).toBe(0);
  });

  it('is normalised: integral D(h) (n.h) dh = 1 (Walter et al. 2007, eq. 4)', () => {
    for (const alpha of [0.05, 0.1, 0.3, 0.6, 1]) {
      // Theta panels concentrated near the pole where narrow lobes live.
      const value = integrateHemisphere((_x, _y, z) => ggxD(z, alpha) * z, 400, 4);
      expect(value).toBeCloseTo(1, 6);
    }
  });

  it('maps xi = 0.5 to tan(theta_h) = alpha (derived)', () => {
    const out = new Float64Array(3);
    sampleGgxHalfVector(out, 0, 0.25, 0.5, 0);
    expect((Math.acos(out[2]!) * 180) / Math.PI).toBeCloseTo(14.0362, 4);
    sampleGgxHalfVector(out, 0, 1, 0.5, 0);
    expect((Math.acos(out[2]!) * 180) / Math.PI).toBeCloseTo(45, 10);
    sampleGgxHalfVector(out, 0, 0.25, 0.9, 0);
    expect((Math.acos(out[2]!) * 180) / Math.PI).toBeCloseTo(36.8699, 4);
  });

  it('round-trips u -> h -> u', () => {
    const h = new Float64Array(3);
    const u = new Float64Array(2);
    for (let i = 1; i < 200; i++) {
      const u1 = i / 200;
      const u2 = radicalInverseBase2(i);
      sampleGgxHalfVector(h, 0, 0.4, u1, u2);
      invertGgxHalfVectorSample(u, 0, h[0]!, h[1]!, h[2]!, 0.4);
      expect(u[0]).toBeCloseTo(u1, 10);
      expect(u[1]).toBeCloseTo(u2, 10);
    }
  });

  it('relates p(l) to p(h) by 1/(4 v.h); n = v gives D/4 (Walter et al. 2007)', () => {
    expect(ggxReflectedPdf(0.9, 0.9, 0.3)).toBeCloseTo(ggxD(0.9, 0.3) / 4, 14);
    expect(ggxReflectedPdf(0.9, 0.5, 0.3)).toBeCloseTo(ggxD(0.9, 0.3) * 0.9 / 2, 14);
  });

  // Chi-square against the analytic pdf (pbrt-v4 bsdfs_test.cpp method); 3 runs, Sidak-corrected alpha 0.01.
  const runs = [0.1, 0.5, 0.9];
  const significance = 1 - Math.pow(1 - 0.01, 1 / (2 * runs.length));
  for (const alpha of runs) {
    it(`passes chi-square for half vectors, alpha ${alpha}`, () => {
      let state = 12345 + Math.round(alpha * 1000);
      const rand = (): number => {
        state = (Math.imul(state, 1664525) + 1013904223) >>> 0; // Numerical Recipes LCG
        return state / 4294967296;
      };
      const out = new Float64Array(3);
      const result = chi2SphereTest(() => {
        sampleGgxHalfVector(out, 0, alpha, rand(), rand());
        return [out[0]!, out[1]!, out[2]!];
      }, (_x, _y, z) => ggxHalfVectorPdf(z, alpha), 1_000_000);
      if (result.pValue < significance) console.log(result.table);
      expect(result.pValue).toBeGreaterThan(significance);
    });

    it(`passes chi-square for visible normals, alpha ${alpha}`, () => {
      let state = 777 + Math.round(alpha * 1000);
      const rand = (): number => {
        state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
        return state / 4294967296;
      };
      const wo = [Math.sin(1.0), 0, Math.cos(1.0)] as const;
      const out = new Float64Array(3);
      const result = chi2SphereTest(() => {
        sampleGgxVndf(out, 0, wo[0], wo[1], wo[2], alpha, rand(), rand());
        return [out[0]!, out[1]!, out[2]!];
      }, (x, y, z) => ggxVndfPdf(wo[0], wo[1], wo[2], x, y, z, alpha), 1_000_000);
      if (result.pValue < significance) console.log(result.table);
      expect(result.pValue).toBeGreaterThan(significance);
    });
  }
});

describe('Smith masking', () => {
  it('matches Lambda and G1 check values (Heitz 2014)', () => {
    expect(smithLambda(0.5, 0.5)).toBeCloseTo(0.161438, 6);
    expect(smithG1(0.5, 0.5)).toBeCloseTo(0.861002, 6);
    for (const mu of [0.2, 0.5, 0.9]) expect(smithLambda(mu, 1)).toBeCloseTo((1 / mu - 1) / 2, 12);
  });

  it('matches height-correlated G2 and V (Heitz 2014)', () => {
    expect(smithG2HeightCorrelated(0.5, 0.8, 0.5)).toBeCloseTo(0.836513, 6);
    expect(smithVisibilityHeightCorrelated(0.5, 0.8, 0.5)).toBeCloseTo(0.522821, 6);
    for (const [nv, nl, a] of [[0.3, 0.7, 0.2], [0.9, 0.1, 0.8], [1, 1, 0.5]] as const) {
      expect(smithVisibilityHeightCorrelated(nv, nl, a)).toBeCloseTo(smithG2HeightCorrelated(nv, nl, a) / (4 * nv * nl), 12);
    }
  });

  it('satisfies the weak white furnace G1(v) integral max(0, v.m) D(m) dm = n.v (Heitz 2014, eq. 2)', () => {
    for (const alpha of [0.05, 0.3, 1]) {
      for (const mu of [0.2, 0.6, 1]) {
        const vx = Math.sqrt(1 - mu * mu);
        const integral = integrateHemisphere((x, _y, z) => Math.max(0, vx * x + mu * z) * ggxD(z, alpha), 400, 64);
        expect(smithG1(mu, alpha) * integral).toBeCloseTo(mu, 5);
      }
    }
  });

  it('visible-normal density integrates to 1 for each wo (Heitz 2018)', () => {
    for (const theta of [0, 0.7, 1.4]) {
      const wo = [Math.sin(theta), 0, Math.cos(theta)] as const;
      const value = integrateHemisphere((x, y, z) => ggxVndfPdf(wo[0], wo[1], wo[2], x, y, z, 0.4), 200, 64);
      expect(value).toBeCloseTo(1, 5);
    }
  });
});

describe('conversions and bases', () => {
  it('alpha = perceptualRoughness^2 (Burley 2012)', () => {
    expect(alphaFromPerceptualRoughness(0.5)).toBe(0.25);
  });

  it('builds right-handed orthonormal bases incl. the poles (Duff et al. 2017)', () => {
    const out = new Float64Array(6);
    const normals = [[0, 0, 1], [0, 0, -1], [1, 0, 0], [0.6, 0, 0.8], [0.3, -0.4, Math.sqrt(0.75)], [0, 1, 0]];
    for (const [nx, ny, nz] of normals as [number, number, number][]) {
      buildOrthonormalBasis(out, 0, nx, ny, nz);
      const [ax, ay, az, bx, by, bz] = [...out] as [number, number, number, number, number, number];
      expect(ax * ax + ay * ay + az * az).toBeCloseTo(1, 14);
      expect(bx * bx + by * by + bz * bz).toBeCloseTo(1, 14);
      expect(ax * bx + ay * by + az * bz).toBeCloseTo(0, 14);
      expect(ax * nx + ay * ny + az * nz).toBeCloseTo(0, 14);
      // cross(b1, b2) = n (right-handed)
      expect(ay * bz - az * by).toBeCloseTo(nx, 14);
      expect(az * bx - ax * bz).toBeCloseTo(ny, 14);
      expect(ax * by - ay * bx).toBeCloseTo(nz, 14);
    }
  });

  it('Charlie sheen distribution is normalised over (n.h) (Estevez & Kulla 2017)', () => {
    for (const alpha of [0.3, 0.6, 1]) {
      expect(integrateHemisphere((_x, _y, z) => charlieD(z, alpha) * z, 200, 4)).toBeCloseTo(1, 4);
    }
  });
});
