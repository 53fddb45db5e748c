/**
 * Specular kernel throughput, one thread: samples per second for one level (r = 0.5, 1024 samples, 64^2
 * faces) with filtered importance sampling, i.e. bilinear fetches from two pyramid levels per sample.
 * "baseline" is a straightforward typed-array version (math-library calls per sample); "kernel" is the
 * shipped prefilterSpecular. Standing target: 25 M samples/s per thread.
 */

import { alphaFromPerceptualRoughness, directionToCubeFace, buildOrthonormalBasis, cubeTexelCenterDirection } from '@lightkiln/math';
import { sharedFloat32, WorkerPool } from '@lightkiln/pool';
import { buildPyramid, buildSampleSet, prefilterSpecular, SPECULAR_LEVEL_STRIDE, SPECULAR_SAMPLE_STRIDE, type Pyramid, type SampleSet } from '@lightkiln/bake/kernels';
import { record, runBench, syntheticSky } from './common.js';

/** The straightforward version: per sample, library face selection and a bilinear helper. */
function baseline(pyramid: Pyramid, set: SampleSet, size: number, dst: Float32Array): void {
  const samples = set.directions;
  const lv = set.levels;
  const n = new Float64Array(3);
  const basis = new Float64Array(6);
  const sel = new Float64Array(3);
  const acc = new Float64Array(3);
  const count = set.count;
  for (let face = 0; face < 6; face++) {
    for (let y = 0; y < size; y++) {
      for (let x = 0; x < size; x++) {
        cubeTexelCenterDirection(n, 0, face, x, y, size);
        buildOrthonormalBasis(basis, 0, n[0]!, n[1]!, n[2]!);
        acc[0] = 0; acc[1] = 0; acc[2] = 0;
        let wsum = 0;
        for (let k = 0; k < count; k++) {
          const o = k * SPECULAR_SAMPLE_STRIDE;
          const lx = samples[o]!; const ly = samples[o + 1]!; const lz = samples[o + 2]!; const w = samples[o + 3]!;
          directionToCubeFace(sel, 0,
            basis[0]! * lx + basis[3]! * ly + n[0]! * lz,
            basis[1]! * lx + basis[4]! * ly + n[1]! * lz,
            basis[2]! * lx + basis[5]! * ly + n[2]! * lz);
          const q = k * SPECULAR_LEVEL_STRIDE;
          bilinear(acc, pyramid.data, lv[q]!, lv[q + 1]!, sel[0]!, sel[1]!, sel[2]!, samples[o + 4]!);
          if (samples[o + 5]! > 0) bilinear(acc, pyramid.data, lv[q + 2]!, lv[q + 3]!, sel[0]!, sel[1]!, sel[2]!, samples[o + 5]!);
          wsum += w;
        }
        const t = ((face * size + y) * size + x) * 3;
        dst[t] = acc[0]! / wsum; dst[t + 1] = acc[1]! / wsum; dst[t + 2] = acc[2]! / wsum;
      }
    }
  }
}

function bilinear(acc: Float64Array, cube: Float32Array, offset: number, n: number, face: number, s: number, t: number, weight: number): void {
  const fx = Math.min(n - 1, Math.max(0, s * n - 0.5));
  const fy = Math.min(n - 1, Math.max(0, t * n - 0.5));
  const x0 = Math.floor(fx); const y0 = Math.floor(fy);
  const x1 = Math.min(n - 1, x0 + 1); const y1 = Math.min(n - 1, y0 + 1);
  const ax = fx - x0; const ay = fy - y0;
  const base = offset + face * n * n * 3;
  for (let c = 0; c < 3; c++) {
    acc[c] = acc[c]! + weight * ((1 - ax) * (1 - ay) * cube[base + (y0 * n + x0) * 3 + c]! + ax * (1 - ay) * cube[base + (y0 * n + x1) * 3 + c]!
      + (1 - ax) * ay * cube[base + (y1 * n + x0) * 3 + c]! + ax * ay * cube[base + (y1 * n + x1) * 3 + c]!);
  }
}

export async function specularBench(): Promise<void> {
  const inline = new WorkerPool({ threads: 0 });
  const W = 1024;
  const source = { kind: 'equirect' as const, width: W, height: W / 2, data: syntheticSky(W, W / 2), sanitized: { nan: 0, infinite: 0, negative: 0, clampedHigh: 0 } };
  const pyramid = await buildPyramid(source, 128, 0, { pool: inline, signal: undefined, onProgress: undefined, targetTileCost: undefined });
  const alpha = alphaFromPerceptualRoughness(0.5);
  const set = buildSampleSet(alpha, pyramid, { sampleCount: 1024, filtered: true, lodBias: 0.5, rotationSeed: 0 });
  const count = set.count;
  const size = 64;
  const texels = 6 * size * size;
  const dst = sharedFloat32(texels * 3);
  const err = sharedFloat32(texels);
  const dstBase = new Float32Array(texels * 3);
  let weightSum = 0;
  let weightSquareSum = 0;
  for (let k = 0; k < count; k++) {
    weightSum += set.directions[k * SPECULAR_SAMPLE_STRIDE + 3]!;
    weightSquareSum += set.directions[k * SPECULAR_SAMPLE_STRIDE + 3]! ** 2;
  }
  const params = { levelBegin: 0, size, dstOffset: 0, sampleOffset: 0, sampleCount: count, clampLuminance: 0, weightSum, weightSquareSum };
  const results = await runBench('specular kernel, one thread, r = 0.5, 64^2 x 6 texels', {
    baseline: () => baseline(pyramid, set, size, dstBase),
    kernel: () => prefilterSpecular({ pyramid: pyramid.data, samples: set.directions, sampleLevels: set.levels, dst, err }, 0, texels, params),
  }, { iterations: 5 });
  const total = texels * count;
  record('specular baseline', total / (results.baseline!.medianMs / 1000) / 1e6, 'M samples/s/thread', `${count} samples with n.l > 0 per texel`);
  record('specular kernel', total / (results.kernel!.medianMs / 1000) / 1e6, 'M samples/s/thread', 'target >= 25');
  let maxDiff = 0;
  for (let i = 0; i < dst.length; i++) maxDiff = Math.max(maxDiff, Math.abs(dst[i]! - dstBase[i]!) / Math.max(1e-6, Math.abs(dstBase[i]!)));
  record('kernel vs baseline max relative difference', maxDiff, '');
  await inline.close();
}
