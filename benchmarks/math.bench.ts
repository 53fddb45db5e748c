/**
 * Math throughput, one thread: GGX half-vector sampling plus the basis transform (samples/s), and a
 * 128 x 128 DFG table at 1024 samples per texel through the shipped kernel (target: under 1.0 s).
 */

import { alphaFromPerceptualRoughness, buildOrthonormalBasis, hammersleyPoint, sampleGgxHalfVector } from '@lightkiln/math';
import { WorkerPool } from '@lightkiln/pool';
import { bakeDfgTable } from '@lightkiln/bake/kernels';
import { record, runBench } from './common.js';

export async function mathBench(): Promise<void> {
  const N = 2_000_000;
  const u = new Float64Array(2);
  const h = new Float64Array(3);
  const basis = new Float64Array(6);
  let sink = 0;
  const alpha = alphaFromPerceptualRoughness(0.5);
  const ggx = (): void => {
    buildOrthonormalBasis(basis, 0, 0.36, 0.48, 0.8);
    for (let i = 0; i < N; i++) {
      hammersleyPoint(u, 0, i, N);
      sampleGgxHalfVector(h, 0, alpha, u[0]!, u[1]!);
      sink += basis[0]! * h[0]! + basis[3]! * h[1]! + 0.36 * h[2]!;
    }
  };
  const inline = new WorkerPool({ threads: 0 });
  const ctx = { pool: inline, signal: undefined, onProgress: undefined, targetTileCost: undefined };
  const results = await runBench('GGX sampling and the DFG table, one thread', {
    'ggx sample + basis transform (2M)': ggx,
    'dfg 128x128 @ 1024 samples': async () => { await bakeDfgTable({ size: 128, samples: 1024, multiscatter: false, cloth: false }, ctx); },
  }, { iterations: 5 });
  record('ggx sample + basis transform', N / (results['ggx sample + basis transform (2M)']!.medianMs / 1000) / 1e6, 'M samples/s/thread');
  record('dfg 128x128 @ 1024 samples, one thread', results['dfg 128x128 @ 1024 samples']!.medianMs / 1000, 's', 'target < 1.0 s');
  if (sink === 42) console.log('');
  await inline.close();
}
