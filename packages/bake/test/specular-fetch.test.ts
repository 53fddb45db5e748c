/**
 * The sampled estimator's inlined cube lookup (kernels/specular.ts) against the face selection of the
 * Vulkan specification ("Cube Map Face Selection and Transformations", as math's directionToCubeFace
 * implements it; tested there against the spec's table). A pyramid whose level-0 texels hold their own
 * (face, x, y), and one sample along n: every output texel must read the texel the spec selects for its
 * centre direction, on every face and at every size.
 */

import { describe, expect, it } from 'vitest';
import { cubeTexelCenterDirection, directionToCubeFace } from '@lightkiln/math';
import { sharedFloat32, sharedFloat64, sharedInt32 } from '@lightkiln/pool';
import { prefilterSpecular, pyramidLayout, SPECULAR_LEVEL_STRIDE, SPECULAR_SAMPLE_STRIDE } from '@lightkiln/bake/kernels';

describe('sampled estimator cube lookup', () => {
  for (const n of [1, 2, 4, 8, 16]) {
    it(`reads the texel the Vulkan face selection gives for every texel centre (size ${n})`, () => {
      const layout = pyramidLayout(n);
      const pyramid = sharedFloat32(layout.length);
      for (let f = 0; f < 6; f++) {
        for (let y = 0; y < n; y++) {
          for (let x = 0; x < n; x++) {
            const o = ((f * n + y) * n + x) * 3;
            pyramid[o] = f + 1; pyramid[o + 1] = x + 1; pyramid[o + 2] = y + 1;
          }
        }
      }
      // One sample along n (tangent frame z), weight 1, all of it on level 0.
      const samples = sharedFloat64(SPECULAR_SAMPLE_STRIDE);
      samples.set([0, 0, 1, 1, 1, 0]);
      const sampleLevels = sharedInt32(SPECULAR_LEVEL_STRIDE);
      sampleLevels.set([0, n, 0, n]);
      const texels = 6 * n * n;
      const dst = sharedFloat32(texels * 3);
      const err = sharedFloat32(texels);
      prefilterSpecular({ pyramid, samples, sampleLevels, dst, err }, 0, texels, {
        levelBegin: 0, size: n, dstOffset: 0, sampleOffset: 0, sampleCount: 1, clampLuminance: 0, weightSum: 1, weightSquareSum: 1,
      });
      const d = new Float64Array(3);
      const sel = new Float64Array(3);
      for (let f = 0; f < 6; f++) {
        for (let y = 0; y < n; y++) {
          for (let x = 0; x < n; x++) {
            cubeTexelCenterDirection(d, 0, f, x, y, n);
            directionToCubeFace(sel, 0, d[0]!, d[1]!, d[2]!);
            const expected = [sel[0]! + 1, Math.min(n - 1, Math.floor(sel[1]! * n)) + 1, Math.min(n - 1, Math.floor(sel[2]! * n)) + 1];
            const o = ((f * n + y) * n + x) * 3;
            expect([dst[o], dst[o + 1], dst[o + 2]], `face ${f} texel ${x}, ${y}`).toEqual(expected);
          }
        }
      }
    });
  }
});
