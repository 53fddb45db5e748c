import { describe, expect, it } from 'vitest';
import {
  cosineHemispherePdf, f0FromIor, invertCosineHemisphereSample, sampleCosineHemisphere, schlickFresnel,
  schlickFresnelAverage, sampleUniformHemisphere,
} from '@lightkiln/math';
import { integrate1d } from '../../../test/helpers/quadrature.js';
import { chi2SphereTest } from '../../../test/helpers/chi2.js';

describe('Schlick Fresnel', () => {
  it('F0 of IOR 1.5 is 0.04 (Fresnel equations at normal incidence)', () => {
    expect(f0FromIor(1.5)).toBeCloseTo(0.04, 15);
  });
  it('matches published values (Schlick 1994)', () => {
    expect(schlickFresnel(0.04, 1, 0.5)).toBeCloseTo(0.07, 12);
    expect(schlickFresnel(0.04, 1, 0.1)).toBeCloseTo(0.60687, 5);
    expect(schlickFresnel(0.04, 1, 1)).toBe(0.04);
    expect(schlickFresnel(0.04, 1, 0)).toBe(1);
  });
  it('has cosine average F0 + (1 - F0)/21', () => {
    const numeric = 2 * integrate1d((mu) => schlickFresnel(0.04, 1, mu) * mu, 0, 1, 16);
    expect(schlickFresnelAverage(0.04)).toBeCloseTo(numeric, 12);
  });
});

describe('cosine hemisphere', () => {
  it('passes chi-square against cos/pi (Shirley & Chiu 1997; pbrt-v4 method)', () => {
    let state = 99;
    const rand = (): number => {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
      return state / 4294967296;
    };
    const out = new Float64Array(3);
    const result = chi2SphereTest(() => {
      sampleCosineHemisphere(out, 0, rand(), rand());
      return [out[0]!, out[1]!, out[2]!];
    }, (_x, _y, z) => cosineHemispherePdf(z), 1_000_000);
    expect(result.pValue).toBeGreaterThan(0.005);
  });
  it('round-trips u -> direction -> u', () => {
    const d = new Float64Array(3);
    const u = new Float64Array(2);
    for (let i = 0; i < 400; i++) {
      const u1 = ((i % 20) + 0.37) / 20;
      const u2 = (Math.floor(i / 20) + 0.61) / 20;
      sampleCosineHemisphere(d, 0, u1, u2);
      expect(d[0]! ** 2 + d[1]! ** 2 + d[2]! ** 2).toBeCloseTo(1, 12);
      invertCosineHemisphereSample(u, 0, d[0]!, d[1]!);
      expect(u[0]).toBeCloseTo(u1, 10);
      expect(u[1]).toBeCloseTo(u2, 10);
    }
  });
  it('uniform hemisphere directions are unit and upward', () => {
    const d = new Float64Array(3);
    sampleUniformHemisphere(d, 0, 0.3, 0.8);
    expect(d[2]).toBeCloseTo(0.3, 14);
    expect(d[0]! ** 2 + d[1]! ** 2 + d[2]! ** 2).toBeCloseTo(1, 14);
  });
});
