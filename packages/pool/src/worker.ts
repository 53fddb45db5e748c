/** The piscina worker entry: runs one tile of a named kernel on shared buffers. */

import { loadKernel, type KernelModule, type KernelRef } from './kernel.js';
import type { SharedBuffers } from './shared.js';

export interface TileTask {
  readonly kernel: KernelRef;
  readonly buffers: SharedBuffers;
  readonly begin: number;
  readonly end: number;
  readonly params: unknown;
}

export default async function runTile(task: TileTask): Promise<number> {
  // A warm-up task (WorkerPool.warm): load the module and run its optional warmUp().
  if (task.kernel.name === '') {
    const mod = (await import(task.kernel.moduleUrl)) as KernelModule;
    if (typeof mod.warmUp === 'function') await mod.warmUp();
    return 0;
  }
  const kernel = await loadKernel(task.kernel);
  kernel(task.buffers, task.begin, task.end, task.params);
  return task.end - task.begin;
}
