/**
 * A farm worker: takes bake jobs from the queue, reads each job's input from the shared cache by digest,
 * bakes with the shared cache behind its local one (so every intermediate and result is shared), uploads
 * the artifacts by digest and returns their list. The processor only awaits the bake (whose work runs on
 * the pool's threads), so the event loop stays free to renew the job's lock; no sandboxed processors.
 */

import { hostname } from 'node:os';
import { Worker, type Job } from 'bullmq';
import { createBaker, HttpStore, LightkilnError, type Recipe } from '@lightkiln/bake';
import { redisConnection } from './connection.js';
import { DEFAULT_QUEUE, type FarmJobData, type FarmJobResult } from './protocol.js';

export interface FarmWorkerOptions {
  readonly redis: string;
  readonly remoteCache: string;
  readonly queue?: string;
  /** Pool threads of this worker's baker; default all cores. */
  readonly threads?: number;
  /** Local cache folder in front of the shared one; default ".lightkiln-cache". */
  readonly cacheDir?: string;
  /**
   * Job lock duration in ms; default 10 000. A live worker renews its lock every half of it (its event loop
   * is free during a bake); a dead worker's job is taken over once the lock lapses and the next stall check
   * (every half lock) runs: within 1.5 x the lock, 15 s by default.
   */
  readonly lockDurationMs?: number;
  /** Log lines (job taken, baked, failed). */
  readonly log?: (line: string) => void;
}

export interface FarmWorker {
  /** Stops taking jobs; waits for the job in progress to finish (its lock keeps it ours meanwhile). */
  close(): Promise<void>;
  readonly name: string;
}

export async function startFarmWorker(options: FarmWorkerOptions): Promise<FarmWorker> {
  const log = options.log ?? (() => undefined);
  const name = `${hostname()}:${process.pid}`;
  const remote = new HttpStore(options.remoteCache);
  const baker = createBaker({
    ...(options.threads !== undefined ? { threads: options.threads } : {}),
    cache: options.cacheDir ?? '.lightkiln-cache',
    remoteCache: options.remoteCache,
    onWarning: (m) => log(`warning: ${m}`),
  });
  const processor = async (job: Job<FarmJobData, FarmJobResult>): Promise<FarmJobResult> => {
    const started = performance.now();
    const input = job.data.inputs[0];
    if (input === undefined || job.data.inputs.length !== 1) throw new Error('a farm job carries exactly one input');
    const bytes = await remote.getBlob(input.digest);
    if (bytes === undefined) throw new Error(`input ${input.name} (${input.digest.slice(0, 12)}) is not in the shared cache`);
    log(`job ${job.id!.slice(0, 12)}: baking ${job.data.recipe.name ?? input.name}`);
    let last = 0;
    const recipe = { ...job.data.recipe, input: { bytes, name: input.name, ...(job.data.layout !== undefined ? { layout: job.data.layout } : {}) } } as Recipe;
    const result = await baker.bake(recipe, {
      onProgress: (p) => {
        const now = performance.now();
        if (now - last < 250) return;
        last = now;
        void job.updateProgress({ stage: p.stage, done: p.done, total: p.total }).catch(() => undefined);
      },
    });
    const artifacts = [];
    for (const a of result.artifacts) {
      const digest = await remote.putBlob(a.bytes);
      artifacts.push({ kind: a.kind, name: a.name, sha256: digest, byteLength: a.bytes.length });
    }
    const fromCache = result.artifacts.filter((a) => a.kind !== 'manifest').every((a) => a.fromCache);
    log(`job ${job.id!.slice(0, 12)}: baked ${result.manifest.probe}${fromCache ? ' (from cache)' : ''}`);
    return { probe: result.manifest.probe, artifacts, ms: Math.round(performance.now() - started), fromCache, worker: name };
  };
  const connection = redisConnection(options.redis);
  const worker = new Worker<FarmJobData, FarmJobResult>(options.queue ?? DEFAULT_QUEUE, processor, {
    connection,
    concurrency: 1,
    lockDuration: options.lockDurationMs ?? 10_000,
    stalledInterval: Math.round((options.lockDurationMs ?? 10_000) / 2),
    maxStalledCount: 2,
  });
  worker.on('failed', (job, error) => log(`job ${job?.id?.slice(0, 12) ?? '?'}: failed: ${error instanceof LightkilnError ? error.message : error.message}`));
  worker.on('error', (error) => log(`worker error: ${error.message}`));
  await worker.waitUntilReady();
  return {
    name,
    async close(): Promise<void> {
      await worker.close();
      connection.disconnect();
      await baker.close();
    },
  };
}
