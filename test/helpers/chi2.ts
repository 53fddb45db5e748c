/**
 * Pearson chi-square goodness-of-fit against an analytic density, in the manner of pbrt-v4's
 * bsdfs_test.cpp (Pharr, Jakob & Humphreys, "Physically Based Rendering", 4th ed.): histogram samples on a
 * theta x phi grid, integrate the pdf over each cell, pool cells expecting fewer than 5, and compare
 * the statistic with the chi-square distribution.
 */

import { integrate2d } from './quadrature.js';

/** Regularised lower incomplete gamma P(a, x) (Press et al., "Numerical Recipes", 3rd ed., sec. 6.2). */
function gammaP(a: number, x: number): number {
  if (x <= 0) return 0;
  const lnGammaA = lnGamma(a);
  if (x < a + 1) {
    let sum = 1 / a;
    let term = sum;
    for (let n = 1; n < 10000; n++) {
      term *= x / (a + n);
      sum += term;
      if (Math.abs(term) < Math.abs(sum) * 1e-15) break;
    }
    return sum * Math.exp(-x + a * Math.log(x) - lnGammaA);
  }
  // Continued fraction for Q (modified Lentz).
  let b = x + 1 - a;
  let c = 1e300;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 10000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < 1e-300) d = 1e-300;
    c = b + an / c;
    if (Math.abs(c) < 1e-300) c = 1e-300;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-15) break;
  }
  return 1 - Math.exp(-x + a * Math.log(x) - lnGammaA) * h;
}

/** ln Gamma by the Lanczos approximation (Numerical Recipes, 3rd ed., sec. 6.1). */
function lnGamma(x: number): number {
  const g = [57.1562356658629235, -59.5979603554754912, 14.1360979747417471, -0.491913816097620199,
    0.339946499848118887e-4, 0.465236289270485756e-4, -0.983744753048795646e-4, 0.158088703224912494e-3,
    -0.210264441724104883e-3, 0.217439618115212643e-3, -0.164318106536763890e-3, 0.844182239838527433e-4,
    -0.261908384015814087e-4, 0.368991826595316234e-5];
  let y = x;
  const tmp = x + 5.2421875;
  const t = (x + 0.5) * Math.log(tmp) - tmp;
  let ser = 0.999999999999997092;
  for (let j = 0; j < 14; j++) ser += g[j]! / ++y;
  return t + Math.log((2.5066282746310005 * ser) / x);
}

export interface Chi2Result { pValue: number; statistic: number; dof: number; table: string }

/**
 * Runs the test for directions on the sphere. `sample(i)` returns the i-th sampled direction as
 * [x, y, z] (or null when the sampler rejected it); `pdf(x, y, z)` is the claimed solid-angle density.
 */
export function chi2SphereTest(sample: (i: number) => readonly [number, number, number] | null, pdf: (x: number, y: number, z: number) => number, sampleCount: number, thetaRes = 80, phiRes = 160): Chi2Result {
  const observed = new Float64Array(thetaRes * phiRes);
  for (let i = 0; i < sampleCount; i++) {
    const d = sample(i);
    if (d === null) continue;
    const theta = Math.acos(Math.min(1, Math.max(-1, d[2])));
    let phi = Math.atan2(d[1], d[0]);
    if (phi < 0) phi += 2 * Math.PI;
    const ti = Math.min(thetaRes - 1, Math.floor((theta / Math.PI) * thetaRes));
    const pi = Math.min(phiRes - 1, Math.floor((phi / (2 * Math.PI)) * phiRes));
    observed[ti * phiRes + pi]! += 1;
  }
  const expected = new Float64Array(thetaRes * phiRes);
  for (let ti = 0; ti < thetaRes; ti++) {
    for (let pi = 0; pi < phiRes; pi++) {
      const t0 = (ti * Math.PI) / thetaRes;
      const t1 = ((ti + 1) * Math.PI) / thetaRes;
      const p0 = (pi * 2 * Math.PI) / phiRes;
      const p1 = ((pi + 1) * 2 * Math.PI) / phiRes;
      expected[ti * phiRes + pi] = sampleCount * integrate2d((theta, phi) => {
        const s = Math.sin(theta);
        return pdf(s * Math.cos(phi), s * Math.sin(phi), Math.cos(theta)) * s;
      }, t0, t1, p0, p1, 1, 1);
    }
  }
  // Sort cells by expected count; pool the small ones (pbrt's approach).
  const order = Array.from(expected.keys()).sort((a, b) => expected[a]! - expected[b]!);
  let pooledE = 0;
  let pooledO = 0;
  let statistic = 0;
  let dof = 0;
  for (const k of order) {
    const e = expected[k]!;
    const o = observed[k]!;
    if (e === 0) {
      if (o > sampleCount * 1e-5) return { pValue: 0, statistic: Infinity, dof: 0, table: `samples in a zero-pdf cell ${k}` };
      continue;
    }
    if (e < 5) {
      pooledE += e;
      pooledO += o;
    } else if (pooledE > 0 && pooledE < 5) {
      pooledE += e;
      pooledO += o;
    } else {
      statistic += ((o - e) * (o - e)) / e;
      dof++;
    }
  }
  if (pooledE > 0) {
    statistic += ((pooledO - pooledE) * (pooledO - pooledE)) / pooledE;
    dof++;
  }
  dof -= 1;
  const pValue = 1 - gammaP(dof / 2, statistic / 2);
  const rows: string[] = [];
  for (let ti = 0; ti < thetaRes; ti += 8) {
    let obs = 0;
    let exp = 0;
    for (let k = ti * phiRes; k < (ti + 8) * phiRes; k++) { obs += observed[k]!; exp += expected[k]!; }
    rows.push(`theta rows ${ti}-${ti + 7}: observed ${obs.toFixed(0)} expected ${exp.toFixed(1)}`);
  }
  return { pValue, statistic, dof, table: rows.join('\n') };
}
