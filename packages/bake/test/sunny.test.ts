/**
 * The default specular chain on sunny skies, against the exact convolution of the analytic environment
 * (test/helpers/sunny-sky.ts: composite Gauss-Legendre over the analytic sky and the sun disc, sharing
 * no code with the bake). Suns 0.25 to 1 degree wide, 10^3 to 10^5 times the sky, on a face, on a face
 * edge, at a cube corner, near the horizon, at the zenith and on the panorama's seam. Figures over a deterministic subset of texel centres
 * (every texel of the small levels), BT.709 luminance: the RMS of the per-texel relative error, its
 * 99.9th percentile, and the RMSE over the level's mean. The manifest's per-level error estimate is
 * checked against the first: never below it, at most 3 x above it (with 0.02% of absolute slack, the
 * precision the float32 levels and the reference are compared at).
 */

import { afterAll, describe, expect, it } from 'vitest';
import { decodeKtx2, encodePfm } from '@lightkiln/codecs';
import { cubeTexelCenterDirection, cubeTexelSolidAngle } from '@lightkiln/math';
import { closeSharedPools, createBaker } from '@lightkiln/bake';
import { errorStats, exactPrefiltered, makeSunnySky, renderEquirect, type SunnySky } from '../../../test/helpers/sunny-sky.js';

const baker = createBaker({ threads: 2, cache: false });
afterAll(async () => {
  await baker.close();
  await closeSharedPools();
});

interface LevelError { level: number; rmse: number; relRms: number; p999: number; estimate: number }

async function measure(env: SunnySky, width: number, size: number, maxTexels = 1500): Promise<{ errors: LevelError[]; energy: { level0: number; source: number } }> {
  const image = renderEquirect(env, width, width / 2);
  const bytes = encodePfm({ width, height: width / 2, channels: 3, data: image });
  const result = await baker.bake({ input: { bytes, name: 'sunny.pfm' }, size, output: { specularFormat: 'rgba32f', irradianceFormat: 'rgba32f' }, dfg: { enabled: false } });
  const spec = decodeKtx2(result.artifacts[0]!.bytes);
  const roughness = result.manifest.recipe.roughness;
  const d = new Float64Array(3);
  const exact = new Float64Array(3);
  const errors: LevelError[] = [];
  for (let m = 1; m < spec.levels.length; m++) {
    const level = spec.levels[m]!;
    const n = level.width;
    const total = 6 * n * n;
    const stride = Math.max(1, Math.floor(total / maxTexels));
    const test: number[] = [];
    const ref: number[] = [];
    for (let t = 0; t < total; t += stride) {
      const face = Math.floor(t / (n * n));
      const rem = t - face * n * n;
      cubeTexelCenterDirection(d, 0, face, rem % n, Math.floor(rem / n), n);
      exactPrefiltered(env, d[0]!, d[1]!, d[2]!, roughness[m]!, exact);
      ref.push(exact[0]!, exact[1]!, exact[2]!);
      test.push(level.data[t * 4]!, level.data[t * 4 + 1]!, level.data[t * 4 + 2]!);
    }
    const s = errorStats(test, ref);
    errors.push({ level: m, rmse: s.rmse, relRms: s.relRms, p999: s.p999, estimate: result.manifest.levels[m]!.relativeErrorEstimate });
  }
  // The irradiance cube (E, by the r = 1 quadrature) against pi times the exact r = 1 convolution.
  const irr = decodeKtx2(result.artifacts[1]!.bytes).levels[0]!;
  const ni = result.manifest.recipe.irradiance.cubeSize;
  const irrTest: number[] = [];
  const irrRef: number[] = [];
  for (let t = 0; t < 6 * ni * ni; t++) {
    const face = Math.floor(t / (ni * ni));
    const rem = t - face * ni * ni;
    cubeTexelCenterDirection(d, 0, face, rem % ni, Math.floor(rem / ni), ni);
    exactPrefiltered(env, d[0]!, d[1]!, d[2]!, 1, exact);
    irrRef.push(Math.PI * exact[0]!, Math.PI * exact[1]!, Math.PI * exact[2]!);
    irrTest.push(irr.data[t * 4]!, irr.data[t * 4 + 1]!, irr.data[t * 4 + 2]!);
  }
  const irradiance = errorStats(irrTest, irrRef);
  errors.push({ level: -1, rmse: irradiance.rmse, relRms: irradiance.relRms, p999: irradiance.p999, estimate: 0 });
  // Energy: the level-0 cube against the source image, both as luminance times solid angle.
  const l0 = spec.levels[0]!;
  let level0 = 0;
  for (let t = 0; t < 6 * size * size; t++) {
    const rem = t % (size * size);
    level0 += cubeTexelSolidAngle(rem % size, Math.floor(rem / size), size) * (0.2126 * l0.data[t * 4]! + 0.7152 * l0.data[t * 4 + 1]! + 0.0722 * l0.data[t * 4 + 2]!);
  }
  let source = 0;
  const H = width / 2;
  for (let j = 0; j < H; j++) {
    const omega = ((2 * Math.PI) / width) * (Math.cos((j * Math.PI) / H) - Math.cos(((j + 1) * Math.PI) / H));
    for (let i = 0; i < width; i++) {
      const o = (j * width + i) * 3;
      source += omega * (0.2126 * image[o]! + 0.7152 * image[o + 1]! + 0.0722 * image[o + 2]!);
    }
  }
  return { errors, energy: { level0, source } };
}

const norm = (v: [number, number, number]): [number, number, number] => {
  const l = Math.hypot(...v);
  return [v[0] / l, v[1] / l, v[2] / l];
};

// The source width sets a floor of its own: a 0.5-degree sun is three pixels of a 2048-wide panorama,
// and the pixel squares spread its light a little more than the exact disc (a peak error of 0.1-0.4% at
// the sharpest level; source-convolution.test.ts shows the bake itself adds almost nothing to that). The
// edge and corner cases are rendered at 4096 so that the floor stays well below the target.
const cases: { name: string; direction: [number, number, number]; diameterDeg: number; ratio: number; size: number; width: number; meanDominated?: true }[] = [
  { name: 'on a face, 0.3 degrees, 2e4', direction: norm([0.42, 0.35, -0.7]), diameterDeg: 0.3, ratio: 2e4, size: 128, width: 2048 },
  { name: 'on the +X/+Z edge, 0.5 degrees, 1e4', direction: norm([1, 0.3, 1]), diameterDeg: 0.5, ratio: 1e4, size: 128, width: 4096 },
  { name: 'at the (1, 1, 1) corner, 1 degree, 1e5', direction: norm([1, 1, 1]), diameterDeg: 1, ratio: 1e5, size: 64, width: 4096 },
  { name: 'near the horizon, 0.25 degrees, 1e3', direction: norm([-0.6, 0.03, 0.8]), diameterDeg: 0.25, ratio: 1e3, size: 64, width: 2048 },
  // Where the panorama is stretched most (its top row is one point) and where its two ends meet.
  { name: 'at the zenith (the panorama\'s pole, the +Y face centre), 0.5 degrees, 2e4', direction: [0, 1, 0], diameterDeg: 0.5, ratio: 2e4, size: 128, width: 4096 },
  { name: 'on the panorama\'s seam near the horizon (+Z), 0.5 degrees, 2e4', direction: norm([0, 0.05, 1]), diameterDeg: 0.5, ratio: 2e4, size: 128, width: 4096 },
  // A 1-degree 3e4 x sun from a 2048-wide image: its peak texels at level 1 are 1300 x the level's mean,
  // so a 0.1-0.25% error there (per texel) is 3.5% RMSE over the mean on all texels, and about half of
  // that is the image's own (a brute-force convolution of its pixels differs from the exact disc by
  // 0.1-0.14% at the same texels). The per-texel figures are as small as in the other cases.
  { name: 'below the horizon of +Y, 1 degree, 3e4, 2048 wide', direction: norm([0.2, -0.5, 0.8]), diameterDeg: 1, ratio: 3e4, size: 128, width: 2048, meanDominated: true },
];

describe('sunny skies against the exact convolution (targets: 0.5% relative RMS, 2% p99.9 per level; error estimate within 1-3 x)', () => {
  for (const c of cases) {
    it(`keeps every level r > 0 within the targets with the sun ${c.name} (size ${c.size})`, async () => {
      const env = makeSunnySky({ direction: c.direction, diameterDeg: c.diameterDeg, ratio: c.ratio });
      const { errors, energy } = await measure(env, c.width, c.size);
      console.log(`${c.name}, size ${c.size} (relative RMS / p99.9 / RMSE over the mean, estimate): ${errors.map((e) => `L${e.level} ${(e.relRms * 100).toFixed(3)}%/${(e.p999 * 100).toFixed(2)}%/${(e.rmse * 100).toFixed(2)}% (est ${(e.estimate * 100).toFixed(3)}%)`).join(', ')}`);
      // The resample keeps the source's energy (sum of luminance x solid angle): measured within 2e-5
      // except with the 1e5 x sun at the cube corner, where 0.02% of it goes missing (sub-cells split 4
      // times along the three faces' edges still leave slivers).
      expect(Math.abs(energy.level0 - energy.source) / energy.source).toBeLessThan(5e-4);
      for (const e of errors) {
        // Level -1 is the irradiance cube (direct cosine convolution of the 64 x 64 level): where a sun
        // sits on the horizon of n, E changes fast and the 3% p99.9 standing target applies.
        expect(e.p999, `level ${e.level} p99.9`).toBeLessThan(e.level < 0 ? 0.03 : 0.02);
        expect(e.relRms, `level ${e.level} relative RMS`).toBeLessThan(0.005);
        // The RMSE over the level's mean: the few texels at the sun's peak dominate it when the sun holds
        // most of the energy (1e5 x a 1-degree disc is 5 x the rest of the sky, its peak 400 x the level's
        // mean at size 64): a 0.1% error at the peak is 0.8% RMSE there.
        if (c.meanDominated !== true) expect(e.rmse, `level ${e.level} RMSE over the mean`).toBeLessThan(0.01);
        if (e.level > 0) {
          expect(e.estimate, `level ${e.level} estimate not below the error`).toBeGreaterThanOrEqual(e.relRms - 2e-4);
          expect(e.estimate, `level ${e.level} estimate at most 3 x the error`).toBeLessThanOrEqual(3 * e.relRms + 2e-4);
        }
      }
    });
  }

  it('is as accurate on a smooth sky (no sun)', async () => {
    const env = makeSunnySky(null);
    const { errors } = await measure(env, 1024, 64);
    for (const e of errors) {
      expect(e.rmse, `level ${e.level}`).toBeLessThan(0.005);
      expect(e.p999, `level ${e.level}`).toBeLessThan(0.01);
    }
  });
});
