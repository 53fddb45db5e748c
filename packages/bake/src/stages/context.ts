/** What every heavy stage needs: the pool, the kernel module, cancellation and progress. */

import { builtModuleUrl, type KernelRef, type WorkerPool } from '@lightkiln/pool';

export interface BakeProgress {
  /** Stage name: "resample", "pyramid", "specular", "irradiance", "dfg", "encode". */
  readonly stage: string;
  /** Work done and total for the stage, in cost units (texels x samples). */
  readonly done: number;
  readonly total: number;
}

export interface StageContext {
  readonly pool: WorkerPool;
  readonly signal: AbortSignal | undefined;
  readonly onProgress: ((progress: BakeProgress) => void) | undefined;
  /** Cost units per tile (texels x samples); default from the pool. */
  readonly targetTileCost: number | undefined;
}

const KERNEL_MODULE = builtModuleUrl(import.meta.url, '../kernels/index.js');

export function kernel(name: string): KernelRef {
  return { moduleUrl: KERNEL_MODULE, name };
}

/** Starts the pool's workers and their kernel import now, beside serial work such as decoding. */
export function warmPool(ctx: StageContext): void {
  ctx.pool.warm(KERNEL_MODULE);
}

/** Pool job options shared by the stages. */
export function jobOptions(ctx: StageContext, stage: string): { signal?: AbortSignal; onProgress?: (p: { done: number; total: number }) => void; targetTileCost?: number } {
  const onProgress = ctx.onProgress;
  return {
    ...(ctx.signal !== undefined ? { signal: ctx.signal } : {}),
    ...(onProgress !== undefined ? { onProgress: (p: { done: number; total: number }) => onProgress({ stage, done: p.done, total: p.total }) } : {}),
    ...(ctx.targetTileCost !== undefined ? { targetTileCost: ctx.targetTileCost } : {}),
  };
}
