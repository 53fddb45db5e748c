/**
 * Warm-up of a pool worker (WorkerPool.warm): the default chain's stages run once, inline in the worker,
 * on a tiny synthetic sky with a bright spot, so every branch of the hot kernels has type feedback before
 * the first real tile. Without it, a long tile compiled on partial feedback deoptimises as soon as it
 * meets a new branch (measured: the equirect splat of a 256 bake ran 2.5 x slower cold than warm).
 */

import { WorkerPool } from '@lightkiln/pool';
import type { StageContext } from '../stages/context.js';
import { irradianceCube, projectSh9 } from '../stages/irradiance.js';
import { buildPyramid } from '../stages/pyramid.js';
import { prefilterLevels } from '../stages/specular.js';

export async function warmUp(): Promise<void> {
  const pool = new WorkerPool({ threads: 0 });
  // The kernels see their buffers and parameters as a worker's tiles do: structured clones (shared
  // memory stays shared). Given the stages' own objects, whose hidden classes differ, the compiled
  // kernels deoptimised on the first real tile ("wrong map") and were compiled again.
  const run = pool.run.bind(pool);
  pool.run = (job) => run({
    ...job,
    buffers: structuredClone(job.buffers),
    params: structuredClone(job.params),
    segmentParams: structuredClone(job.segmentParams),
  });
  const ctx: StageContext = { pool, signal: undefined, onProgress: undefined, targetTileCost: undefined };
  const width = 64;
  const height = 32;
  const data = new Float32Array(width * height * 3);
  for (let j = 0; j < height; j++) {
    for (let i = 0; i < width; i++) {
      const o = (j * width + i) * 3;
      const v = 0.2 + ((i * 7 + j * 13) % 11) / 11;
      data[o] = v;
      data[o + 1] = 0.8 * v;
      data[o + 2] = 0.6 * v;
    }
  }
  data[(10 * width + 20) * 3] = 5000;
  data[(10 * width + 20) * 3 + 1] = 4000;
  const source = { kind: 'equirect' as const, width, height, data, sanitized: { nan: 0, infinite: 0, negative: 0, clampedHigh: 0 } };
  const pyramid = await buildPyramid(source, 8, 10, ctx);
  const requests = [1, 2, 3].map((level) => ({ level, faceSize: 8 >> level, perceptualRoughness: level / 3, requestedSamples: 16 }));
  await prefilterLevels(pyramid, requests, { filtered: true, lodBias: 0.5, clampLuminance: 0, rotateSequence: false, quality: 'quadrature' }, ctx);
  await projectSh9(pyramid, 0, 'none', 3, ctx);
  await irradianceCube(pyramid, 4, 'convolution', () => Promise.resolve({ radiance: new Float64Array(27), irradiance: new Float64Array(27) }), ctx);
  await pool.close();
}
