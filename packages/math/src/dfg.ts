/**
 * Integrands of the split-sum DFG table (Karis 2013, "Real Shading in Unreal Engine 4", SIGGRAPH course):
 * A = integral f (1 - Fc) (n.l) dl and B = integral f Fc (n.l) dl with f = D V, Fc = (1 - v.h)^5, GGX D and
 * height-correlated Smith V, so that specular albedo = F0 A + f90 B. Local frame: n = +z, v in the xz-plane.
 */

import { PI } from './constants.js';
import { charlieD, neubeltVisibility } from './microfacet.js';
import { radicalInverseBase2 } from './sequence.js';

/**
 * Precomputes a GGX half-vector sample set for one alpha: per sample (cos theta_h, sin theta_h, cos phi)
 * from the N-point Hammersley set, sampled with density D(h)(n.h) (Walter et al. 2007). The set depends only
 * on alpha and N, so one set serves a whole table row.
 */
export function createGgxHalfVectorSet(alpha: number, sampleCount: number): Float64Array {
  const set = new Float64Array(sampleCount * 3);
  fillGgxHalfVectorSet(set, alpha, sampleCount);
  return set;
}

/** Fills set[0 .. 3 * sampleCount) like createGgxHalfVectorSet, reusing the caller's array. */
export function fillGgxHalfVectorSet(set: Float64Array, alpha: number, sampleCount: number): void {
  const a2 = alpha * alpha;
  for (let i = 0; i < sampleCount; i++) {
    const u1 = i / sampleCount;
    const u2 = radicalInverseBase2(i);
    const cos2 = (1 - u1) / (1 + (a2 - 1) * u1);
    set[3 * i] = Math.sqrt(cos2);
    set[3 * i + 1] = Math.sqrt(Math.max(0, 1 - cos2));
    set[3 * i + 2] = Math.cos(2 * PI * u2);
  }
}

/**
 * Monte Carlo estimate of the DFG terms A, B at n.v = nDotV for the set's alpha; writes A to out[o] and B
 * to out[o + 1]. Per sample the estimator is (1 - Fc or Fc) G2 (v.h) / ((n.h)(n.v)), l = 2 (v.h) h - v,
 * samples with n.l <= 0 contribute 0 (pdf p(l) = D (n.h) / (4 v.h); Heitz 2014 G2).
 */
export function integrateDfg(out: Float64Array, o: number, nDotV: number, alpha: number, halfVectorSet: Float64Array, sampleCount: number = halfVectorSet.length / 3): void {
  const mu = nDotV;
  const sinV = Math.sqrt(Math.max(0, 1 - mu * mu));
  const a2 = alpha * alpha;
  // Lambda(v) with tan^2 = (1 - mu^2) / mu^2 (Heitz 2014).
  const lambdaV = 0.5 * (-1 + Math.sqrt(1 + (a2 * (1 - mu * mu)) / (mu * mu)));
  const n = sampleCount;
  let sumA = 0;
  let sumB = 0;
  for (let i = 0; i < n; i++) {
    const cosH = halfVectorSet[3 * i]!;
    const vDotH = sinV * halfVectorSet[3 * i + 1]! * halfVectorSet[3 * i + 2]! + mu * cosH;
    const nDotL = 2 * vDotH * cosH - mu;
    if (nDotL <= 0 || vDotH <= 0) continue;
    const nl2 = nDotL * nDotL;
    const lambdaL = 0.5 * (-1 + Math.sqrt(1 + (a2 * (1 - nl2)) / nl2));
    const g2 = 1 / (1 + lambdaV + lambdaL);
    const w = (g2 * vDotH) / (cosH * mu);
    const m = 1 - vDotH;
    const m2 = m * m;
    const fc = m2 * m2 * m;
    sumA += (1 - fc) * w;
    sumB += fc * w;
  }
  out[o] = sumA / n;
  out[o + 1] = sumB / n;
}

/**
 * Hemispherical-cosine average of the single-scattering albedo, E_avg = 2 integral E(mu) mu dmu with
 * E = A + B (Kulla & Conty 2017, "Revisiting Physically Based Shading at Imageworks"), by the midpoint rule
 * over `muCount` values of mu using the same half-vector set.
 */
export function dfgAverageAlbedo(alpha: number, halfVectorSet: Float64Array, muCount: number): number {
  const ab = new Float64Array(2);
  let sum = 0;
  for (let j = 0; j < muCount; j++) {
    const mu = (j + 0.5) / muCount;
    integrateDfg(ab, 0, mu, alpha, halfVectorSet);
    sum += (ab[0]! + ab[1]!) * mu;
  }
  return (2 * sum) / muCount;
}

/**
 * Total directional albedo with multiple-scattering compensation for image-based lighting
 * (Fdez-Aguera 2019, "A Multiple-Scattering Microfacet Model for Real-Time Image-based Lighting", JCGT 8(1)):
 * FssEss = F0 A + B, Ess = A + B, Ems = 1 - Ess, Favg = F0 + (1 - F0)/21, Fms = FssEss Favg / (1 - Ems Favg);
 * returns FssEss + Fms Ems (f90 = 1).
 */
export function multipleScatteringAlbedo(f0: number, a: number, b: number): number {
  const fssEss = f0 * a + b;
  const ess = a + b;
  const ems = 1 - ess;
  const favg = f0 + (1 - f0) / 21;
  const fms = (fssEss * favg) / (1 - ems * favg);
  return fssEss + fms * ems;
}

/**
 * Energy-compensation factor 1 + F0 (1 - Ess) / Ess applied to single scattering (Turquin 2019, "Practical
 * multiple scattering compensation for microfacet models", Weta Digital tech report).
 */
export function turquinCompensation(f0: number, a: number, b: number): number {
  const ess = a + b;
  return 1 + (f0 * (1 - ess)) / ess;
}

/**
 * Directional albedo of the cloth lobe, integral D_charlie V_neubelt (n.l) dl over the hemisphere, for
 * n.v = nDotV; uniform hemisphere sampling of l over the N-point Hammersley set (estimator f (n.l) 2 pi).
 * Charlie D from Estevez & Kulla 2017, visibility from Neubelt & Pettineo 2013.
 */
export function integrateClothAlbedo(nDotV: number, alpha: number, sampleCount: number): number {
  const mu = nDotV;
  const sinV = Math.sqrt(Math.max(0, 1 - mu * mu));
  let sum = 0;
  for (let i = 0; i < sampleCount; i++) {
    const lz = (i + 0.5) / sampleCount;
    const phi = 2 * PI * radicalInverseBase2(i);
    const lr = Math.sqrt(Math.max(0, 1 - lz * lz));
    const lx = lr * Math.cos(phi);
    // h = normalize(v + l), v = (sinV, 0, mu)
    const hx = sinV + lx;
    const hy = lr * Math.sin(phi);
    const hz = mu + lz;
    const hl = Math.sqrt(hx * hx + hy * hy + hz * hz);
    if (hl === 0) continue;
    sum += charlieD(hz / hl, alpha) * neubeltVisibility(mu, lz) * lz;
  }
  return (sum * 2 * PI) / sampleCount;
}
