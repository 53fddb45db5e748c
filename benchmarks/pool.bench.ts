/**
 * Pool figures: speed-up of a CPU-bound kernel on 2 threads against 1 (target >= 1.8x on 2 cores), and
 * the overhead per tile of an empty kernel (target < 50 us), from the pool's own test kernels.
 */

import { sharedFloat32, WorkerPool } from '@lightkiln/pool';
import { record, runBench } from './common.js';

const moduleUrl = new URL('../../packages/pool/test/fixtures/kernels.mjs', import.meta.url).href;

export async function poolBench(): Promise<void> {
  const n = 6 * 64 * 64;
  const src = sharedFloat32(n);
  const dst = sharedFloat32(n);
  const segments = [{ begin: 0, end: n, costPerItem: 400, rowLength: 64 }];
  const one = new WorkerPool({ threads: 1 });
  const two = new WorkerPool({ threads: 2 });
  const job = { kernel: { moduleUrl, name: 'mix' }, buffers: { src, dst }, segments, params: { work: 400 }, targetTileCost: 400 * 64 * 4 };
  await one.run(job);
  await two.run(job);
  const results = await runBench('CPU-bound kernel, 1 vs 2 threads', {
    '1 thread': () => one.run(job),
    '2 threads': () => two.run(job),
  }, { iterations: 7 });
  record('speed-up 2 threads vs 1', results['1 thread']!.medianMs / results['2 threads']!.medianMs, 'x', 'target >= 1.8');
  const tiles = 4000;
  const emptyJob = { kernel: { moduleUrl, name: 'empty' }, buffers: { src, dst }, segments: [{ begin: 0, end: tiles, costPerItem: 1, rowLength: 1 }], targetTileCost: 1 };
  await two.run(emptyJob);
  const overhead = await runBench('empty kernel, 4000 tiles of one item', { '2 threads': () => two.run(emptyJob), '1 thread': () => one.run(emptyJob) }, { iterations: 7 });
  record('overhead per tile, 2 threads', (overhead['2 threads']!.medianMs * 1000) / tiles, 'us/tile', 'target < 50');
  record('overhead per tile, 1 thread', (overhead['1 thread']!.medianMs * 1000) / tiles, 'us/tile');
  await one.close();
  await two.close();
}
