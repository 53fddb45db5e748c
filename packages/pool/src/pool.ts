/**
 * The texel-parallel scheduler: one piscina pool per process (per thread count), jobs made of tiles of
 * a named kernel over shared buffers, fair interleaving of concurrent jobs, throttled progress,
 * cancellation by AbortSignal, and failures mapped onto PoolError.
 */

import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { abortedError, invalidJobError, PoolError, poolClosedError, tileFailedError, type TileDescription } from './errors.js';
import { builtModuleUrl, loadKernel, type KernelRef } from './kernel.js';
import { planTiles, totalCost, type Segment, type Tile } from './ranges.js';
import { isShared, type SharedBuffers } from './shared.js';
import type { TileTask } from './worker.js';

export interface PoolOptions {
  /**
   * Worker threads. Default: os.availableParallelism(). 0 runs every kernel inline on the calling thread
   * (same kernels, same results; for debugging and tiny jobs). Range 0..256.
   */
  readonly threads?: number;
}

export interface JobProgress {
  /** Work finished and total work, in the job's cost units (items x cost per item). */
  readonly done: number;
  readonly total: number;
  readonly tilesDone: number;
  readonly tilesTotal: number;
}

export interface PoolJob<P = unknown> {
  readonly kernel: KernelRef<P>;
  readonly buffers: SharedBuffers;
  readonly segments: readonly Segment[];
  /** Parameters for every tile, or one entry per segment (structured-cloneable, small). */
  readonly params?: P;
  readonly segmentParams?: readonly P[];
  /** Cost units per tile; default 200 000 (about 2-5 ms of a GGX kernel). */
  readonly targetTileCost?: number;
  readonly signal?: AbortSignal;
  readonly onProgress?: (progress: JobProgress) => void;
  /** Minimum milliseconds between progress events (the last event is always sent). Default 100. */
  readonly progressIntervalMs?: number;
  /**
   * 'foreground' (default) or 'background': a background job's tiles go to a worker only while no
   * foreground job has a tile waiting, so work off the critical path (a lookup table, a side artifact)
   * fills idle workers instead of delaying the chain that decides when a bake ends. Results do not depend
   * on it.
   */
  readonly priority?: 'foreground' | 'background';
}

/** One running threaded job as the dispatcher sees it. */
interface ActiveJob {
  readonly background: boolean;
  /** Launches the job's next tile; false when it has none left to launch. */
  readonly launchNext: () => void;
  readonly hasNext: () => boolean;
}

export interface JobResult {
  readonly tiles: number;
  readonly cost: number;
  readonly elapsedMs: number;
}

export const DEFAULT_TARGET_TILE_COST = 200_000;

/**
 * Tiles handed to each worker at once: the one it runs and the next, already in its message queue, so a
 * worker goes from tile to tile without waiting for this thread to answer (which it cannot while it runs
 * JavaScript of its own: decoding, encoding, a caller's callback).
 */
const TILES_PER_WORKER = 2;

function describeTile(tile: Tile, segments: readonly Segment[]): TileDescription {
  const seg = segments[tile.segment];
  return { segment: tile.segment, label: seg?.label ?? `segment ${tile.segment}`, begin: tile.begin, end: tile.end };
}

export class WorkerPool {
  readonly threads: number;
  #piscina: Piscina | null = null;
  #closed = false;

  constructor(options: PoolOptions = {}) {
    const threads = options.threads ?? availableParallelism();
    if (!Number.isInteger(threads) || threads < 0 || threads > 256) {
      throw invalidJobError(`threads must be an integer in 0..256, got ${String(options.threads)}`);
    }
    this.threads = threads;
  }

  get closed(): boolean {
    return this.#closed;
  }

  #failActive: Set<(error: PoolError) => void> = new Set();
  /** Threaded jobs with tiles left to launch, in arrival order; tiles in flight across all of them. */
  #active: ActiveJob[] = [];
  #inFlight = 0;
  #turn = 0;

  /**
   * Hands tiles to piscina until TILES_PER_WORKER per thread are in flight (the next tile waits in each
   * worker's queue, hiding the message latency, while a background tile waits ahead of a later
   * foreground one for at most one tile per worker). Foreground jobs first; jobs of one priority take
   * turns, so concurrent jobs interleave.
   */
  #pump(): void {
    const limit = this.threads * TILES_PER_WORKER;
    while (this.#inFlight < limit) {
      const jobs = this.#active;
      let picked: ActiveJob | undefined;
      for (const background of [false, true]) {
        for (let i = 0; i < jobs.length && picked === undefined; i++) {
          const job = jobs[(this.#turn + i) % jobs.length]!;
          if (job.background === background && job.hasNext()) picked = job;
        }
        if (picked !== undefined) break;
      }
      if (picked === undefined) return;
      this.#turn = (jobs.indexOf(picked) + 1) % jobs.length;
      this.#inFlight++;
      picked.launchNext();
    }
  }

  #workers(): Piscina {
    if (this.#piscina === null) {
      const filename = builtModuleUrl(import.meta.url, './worker.js');
      if (!existsSync(fileURLToPath(filename))) {
        throw new PoolError('KERNEL_NOT_FOUND', `the pool's built worker ${fileURLToPath(filename)} is missing; run the build (pnpm run build) first`);
      }
      const workerArgv = workerExecArgv(process.execArgv);
      this.#piscina = new Piscina({
        filename,
        // Workers load built files: drop any "--conditions" (e.g. a test runner's source condition).
        ...(workerArgv === undefined ? {} : { execArgv: workerArgv }),
        minThreads: this.threads,
        maxThreads: this.threads,
        concurrentTasksPerWorker: TILES_PER_WORKER,
        idleTimeout: 60_000,
      });
      // A worker that cannot start (or dies outside a task) fails the running jobs instead of hanging them.
      this.#piscina.on('error', (error: unknown) => {
        const failure = new PoolError('WORKER_DIED', `a pool worker failed: ${error instanceof Error ? error.message : String(error)}`, { cause: error });
        for (const fail of [...this.#failActive]) fail(failure);
      });
    }
    return this.#piscina;
  }

  /**
   * Starts the workers now and has them import the kernel module at `moduleUrl`, so the first job does
   * not wait for thread start-up and module compilation (call it before slow serial work, e.g. decoding
   * the input). Best effort: failures surface in the first real job instead. No-op inline.
   */
  warm(moduleUrl: string): void {
    if (this.#closed || this.threads === 0 || this.#piscina !== null) return;
    let piscina: Piscina;
    try {
      piscina = this.#workers();
    } catch {
      return;
    }
    for (let i = 0; i < this.threads; i++) {
      const task: TileTask = { kernel: { moduleUrl, name: '' }, buffers: {}, begin: 0, end: 0, params: undefined };
      piscina.run(task).catch(() => undefined);
    }
  }

  /** Runs every tile of a job; resolves when all are written, rejects on abort or the first failure. */
  run<P>(job: PoolJob<P>): Promise<JobResult> {
    if (this.#closed) return Promise.reject(poolClosedError());
    for (const [name, array] of Object.entries(job.buffers)) {
      if (this.threads > 0 && !isShared(array)) {
        return Promise.reject(invalidJobError(`buffer "${name}" is not backed by a SharedArrayBuffer`));
      }
    }
    if (job.segmentParams !== undefined && job.segmentParams.length !== job.segments.length) {
      return Promise.reject(invalidJobError('segmentParams must have one entry per segment'));
    }
    if (job.signal?.aborted) return Promise.reject(abortedError(job.signal.reason));
    const tiles = planTiles(job.segments, { targetCost: job.targetTileCost ?? DEFAULT_TARGET_TILE_COST });
    return this.threads === 0 ? this.#runInline(job, tiles) : this.#runThreaded(job, tiles);
  }

  #runThreaded<P>(job: PoolJob<P>, tiles: readonly Tile[]): Promise<JobResult> {
    const started = performance.now();
    const total = totalCost(tiles);
    let piscina: Piscina;
    try {
      piscina = this.#workers();
    } catch (error) {
      return Promise.reject(error);
    }
    const interval = job.progressIntervalMs ?? 100;
    return new Promise<JobResult>((resolve, reject) => {
      let next = 0;
      let done = 0;
      let tilesDone = 0;
      let settled = false;
      let lastProgress = 0;
      const active: ActiveJob = {
        background: job.priority === 'background',
        hasNext: () => !settled && next < tiles.length,
        launchNext: () => {
          const tile = tiles[next++]!;
          const task: TileTask = {
            kernel: job.kernel,
            buffers: job.buffers,
            begin: tile.begin,
            end: tile.end,
            params: job.segmentParams === undefined ? job.params : job.segmentParams[tile.segment],
          };
          piscina.run(task).then(() => {
            this.#tileEnded();
            if (settled) return;
            done += tile.cost;
            tilesDone++;
            report();
            if (tilesDone === tiles.length) finish(null);
          }, (error: unknown) => {
            this.#tileEnded();
            if (settled) return;
            finish(this.#closed ? poolClosedError() : tileFailedError(job.kernel.name, describeTile(tile, job.segments), error));
          });
        },
      };
      const onAbort = (): void => finish(abortedError(job.signal?.reason));
      const finish = (error: PoolError | null): void => {
        if (settled) return;
        settled = true;
        job.signal?.removeEventListener('abort', onAbort);
        this.#failActive.delete(finish);
        this.#retire(active);
        if (error === null) resolve({ tiles: tiles.length, cost: total, elapsedMs: performance.now() - started });
        else reject(error);
      };
      job.signal?.addEventListener('abort', onAbort, { once: true });
      this.#failActive.add(finish);
      const report = (): void => {
        if (job.onProgress === undefined) return;
        const now = performance.now();
        if (tilesDone === tiles.length || now - lastProgress >= interval) {
          lastProgress = now;
          job.onProgress({ done, total, tilesDone, tilesTotal: tiles.length });
        }
      };
      if (tiles.length === 0) {
        report();
        finish(null);
        return;
      }
      this.#active.push(active);
      this.#pump();
    });
  }

  /** A tile came back (done or failed): its slot goes to the next waiting tile. */
  #tileEnded(): void {
    this.#inFlight--;
    this.#pump();
  }

  /** A settled job leaves the dispatcher (its tiles in flight still end through #tileEnded). */
  #retire(job: ActiveJob): void {
    const i = this.#active.indexOf(job);
    if (i < 0) return;
    this.#active.splice(i, 1);
    if (this.#turn > i) this.#turn--;
    if (this.#turn >= this.#active.length) this.#turn = 0;
  }

  async #runInline<P>(job: PoolJob<P>, tiles: readonly Tile[]): Promise<JobResult> {
    const started = performance.now();
    const total = totalCost(tiles);
    let kernel;
    try {
      kernel = await loadKernel(job.kernel);
    } catch (error) {
      throw new PoolError('KERNEL_NOT_FOUND', `cannot load kernel "${job.kernel.name}" from ${job.kernel.moduleUrl}: ${error instanceof Error ? error.message : String(error)}`, { cause: error, kernel: job.kernel.name });
    }
    const interval = job.progressIntervalMs ?? 100;
    let done = 0;
    let lastProgress = 0;
    let lastYield = performance.now();
    for (let i = 0; i < tiles.length; i++) {
      if (job.signal?.aborted) throw abortedError(job.signal.reason);
      if (this.#closed) throw poolClosedError();
      const tile = tiles[i]!;
      const params = job.segmentParams === undefined ? job.params : job.segmentParams[tile.segment];
      try {
        kernel(job.buffers, tile.begin, tile.end, params);
      } catch (error) {
        throw tileFailedError(job.kernel.name, describeTile(tile, job.segments), error);
      }
      done += tile.cost;
      const now = performance.now();
      if (job.onProgress !== undefined && (i === tiles.length - 1 || now - lastProgress >= interval)) {
        lastProgress = now;
        job.onProgress({ done, total, tilesDone: i + 1, tilesTotal: tiles.length });
      }
      // Let timers, abort signals and other jobs run about every 10 ms.
      if (now - lastYield > 10) {
        await new Promise<void>((r) => setImmediate(r));
        lastYield = performance.now();
      }
    }
    if (job.signal?.aborted) throw abortedError(job.signal.reason);
    if (tiles.length === 0) job.onProgress?.({ done: 0, total: 0, tilesDone: 0, tilesTotal: 0 });
    return { tiles: tiles.length, cost: total, elapsedMs: performance.now() - started };
  }

  /** Ends all workers; running jobs reject with POOL_CLOSED. Idempotent. */
  async close(): Promise<void> {
    if (this.#closed) return;
    this.#closed = true;
    // Jobs waiting in the dispatcher have no tile in flight for piscina to reject: fail them here.
    for (const fail of [...this.#failActive]) fail(poolClosedError());
    const piscina = this.#piscina;
    this.#piscina = null;
    if (piscina !== null) await piscina.destroy();
    for (const [key, pool] of sharedPools) if (pool === this) sharedPools.delete(key);
  }
}

const isConditions = (arg: string): boolean => arg === '--conditions' || arg === '-C' || arg.startsWith('--conditions=') || arg.startsWith('-C=');

const workerAccepts = new Map<string, boolean>();

/**
 * Whether a worker thread takes `flag` in its execArgv. Node rejects V8 and process-wide options there
 * (--max-old-space-size, --stack-size, --jitless: they already apply to every thread); it says so by
 * throwing from the constructor, before a thread starts. Asked once per flag.
 */
function acceptedByWorkers(flag: string): boolean {
  // Module hooks are worker options (and a probe would run them): no need to ask.
  if (/^--(import|require|loader|experimental-loader)=/.test(flag) || /^-r=/.test(flag)) return true;
  let accepted = workerAccepts.get(flag);
  if (accepted === undefined) {
    try {
      void new Worker('', { eval: true, execArgv: [flag], stdout: true, stderr: true }).terminate();
      accepted = true;
    } catch {
      accepted = false;
    }
    workerAccepts.set(flag, accepted);
  }
  return accepted;
}

/**
 * The execArgv for pool workers: undefined (inherit the parent's, Node's default) unless it holds
 * --conditions / -C, which would point workers at TypeScript sources (a test runner's source condition);
 * then the parent's flags without those, and without the ones a worker refuses.
 */
export function workerExecArgv(execArgv: readonly string[]): string[] | undefined {
  if (!execArgv.some(isConditions)) return undefined;
  const out: string[] = [];
  for (let i = 0; i < execArgv.length; i++) {
    const arg = execArgv[i]!;
    if (arg === '--conditions' || arg === '-C') {
      i++;
      continue;
    }
    if (isConditions(arg)) continue;
    // A flag's separate value (e.g. "--import x") travels with it.
    const value = execArgv[i + 1];
    const paired = value !== undefined && !value.startsWith('-') && !arg.includes('=');
    if (acceptedByWorkers(paired ? `${arg}=${value}` : arg)) out.push(arg, ...(paired ? [value] : []));
    if (paired) i++;
  }
  return out;
}

const sharedPools = new Map<number, WorkerPool>();

/**
 * The process-wide pool for a thread count (default: available parallelism), created on first use and
 * shared by every bake in the process. Call closeSharedPools() before exit to end the workers.
 */
export function getSharedPool(options: PoolOptions = {}): WorkerPool {
  const threads = options.threads ?? availableParallelism();
  let pool = sharedPools.get(threads);
  if (pool === undefined || pool.closed) {
    pool = new WorkerPool({ threads });
    sharedPools.set(threads, pool);
  }
  return pool;
}

/** Closes every shared pool of this process. */
export async function closeSharedPools(): Promise<void> {
  const pools = [...sharedPools.values()];
  sharedPools.clear();
  await Promise.all(pools.map((pool) => pool.close()));
}
