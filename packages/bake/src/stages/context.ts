/** What every heavy stage needs: the pool, the kernel module, cancellation and progress. */

import type { KernelRef, WorkerPool } from '@lightkiln/pool';
import { invalidOption, LightkilnError } from '../errors.js';
import type { BakeEvent } from '../events.js';
import { KERNEL_MODULE } from '../kernel-module.js';

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

type Kernels = import('../kernels/index.js').BakeKernels;
/** The names of the bake's kernels. */
export type KernelName = keyof Kernels;
/** The parameter object a kernel takes (its fourth argument). */
export type KernelParams<N extends KernelName> = Parameters<Kernels[N]>[3];

/** A typed reference to one of the bake's kernels: a job's params must match the kernel's. */
export function kernel<N extends KernelName>(name: N): KernelRef<KernelParams<N>> {
  return { moduleUrl: KERNEL_MODULE, name };
}

/** Starts the pool's workers and their kernel import now, beside serial work such as decoding. */
export function warmPool(ctx: StageContext): void {
  ctx.pool.warm(KERNEL_MODULE);
}

/**
 * Stages off the critical path (resample -> pyramid -> specular levels, the longest chain): their
 * tiles run on the pool's background priority, filling workers that the chain leaves idle (while the
 * input decodes, between levels, at the end) instead of delaying it.
 */
const BACKGROUND_STAGES: ReadonlySet<string> = new Set(['dfg', 'irradiance']);

/** Pool job options shared by the stages. */
export function jobOptions(ctx: StageContext, stage: string): { signal?: AbortSignal; onProgress?: (p: { done: number; total: number }) => void; targetTileCost?: number; priority: 'foreground' | 'background' } {
  const onProgress = ctx.onProgress;
  return {
    priority: BACKGROUND_STAGES.has(stage) ? 'background' : 'foreground',
    ...(ctx.signal !== undefined ? { signal: ctx.signal } : {}),
    ...(onProgress !== undefined ? { onProgress: (p: { done: number; total: number }) => onProgress({ stage, done: p.done, total: p.total }) } : {}),
    ...(ctx.targetTileCost !== undefined ? { targetTileCost: ctx.targetTileCost } : {}),
  };
}

/**
 * A stage context for one bake call, with the caller's callbacks guarded: a progress or event callback
 * that throws stops the bake (its tiles are aborted) instead of escaping into a worker's promise chain,
 * and the bake then rejects with the callback's error (`failure()`). A non-function callback is an
 * option error. `emit` delivers structured events (progress included).
 */
export function guardedContext(pool: WorkerPool, options: { readonly signal?: AbortSignal | undefined; readonly onProgress?: unknown; readonly onEvent?: unknown }, targetTileCost: number | undefined): { ctx: StageContext; emit: (event: BakeEvent) => void; failure: () => unknown } {
  const user = options.onProgress;
  const onEvent = options.onEvent;
  if (user !== undefined && typeof user !== 'function') throw invalidOption('onProgress', 'must be a function', typeof user);
  if (onEvent !== undefined && typeof onEvent !== 'function') throw invalidOption('onEvent', 'must be a function', typeof onEvent);
  if (options.signal !== undefined && !(options.signal instanceof AbortSignal)) throw invalidOption('signal', 'must be an AbortSignal', typeof options.signal);
  if (user === undefined && onEvent === undefined) return { ctx: { pool, signal: options.signal, onProgress: undefined, targetTileCost }, emit: () => undefined, failure: () => undefined };
  const controller = new AbortController();
  const signal = options.signal === undefined ? controller.signal : AbortSignal.any([options.signal, controller.signal]);
  let thrown: unknown;
  let failed = false;
  let which = '';
  const guard = (name: string, fn: () => void): void => {
    if (failed) return;
    try {
      fn();
    } catch (error) {
      failed = true;
      thrown = error;
      which = name;
      controller.abort(error);
    }
  };
  const emit = (event: BakeEvent): void => {
    if (onEvent !== undefined) guard('onEvent', () => (onEvent as (e: BakeEvent) => void)(event));
  };
  const onProgress = (progress: BakeProgress): void => {
    if (user !== undefined) guard('onProgress', () => (user as (p: BakeProgress) => void)(progress));
    emit({ type: 'progress', stage: progress.stage, done: progress.done, total: progress.total });
  };
  const failure = (): unknown => (failed ? new LightkilnError('BAKE_FAILED', `the ${which} callback threw: ${thrown instanceof Error ? thrown.message : String(thrown)}`, { cause: thrown }) : undefined);
  return { ctx: { pool, signal, onProgress, targetTileCost }, emit, failure };
}
