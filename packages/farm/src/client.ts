/**
 * Submitting bakes to the farm: inputs go to the shared cache by digest, one job per probe goes to the
 * queue (id = the bake's identity, so duplicates bake once), and the client waits for every job, then
 * fetches each artifact from the shared cache by digest (verified) for the caller to write.
 */

import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { Queue, QueueEvents } from 'bullmq';
import { HttpStore, LightkilnError, type Recipe } from '@lightkiln/bake';
import type { Redis } from 'ioredis';
import { redisConnection } from './connection.js';
import { DEFAULT_QUEUE, jobIdFor, type FarmJobData, type FarmJobResult } from './protocol.js';

export interface FarmClientOptions {
  readonly redis: string;
  readonly remoteCache: string;
  readonly queue?: string;
  /** Progress lines (probe, stage, fraction) while waiting. */
  readonly onProgress?: (probe: string, progress: { stage: string; done: number; total: number }) => void;
  /** Called once per job when it is on the queue (or found there already: same id, same bake). */
  readonly onSubmitted?: (probe: string, jobId: string) => void;
  /** Milliseconds to wait for one job before giving up; default 1 hour. */
  readonly jobTimeoutMs?: number;
}

export interface FarmProbeResult {
  readonly probe: string;
  readonly ok: boolean;
  readonly jobId: string;
  readonly result?: FarmJobResult;
  /** Artifact bytes by name (fetched from the shared cache and verified). */
  readonly files?: ReadonlyMap<string, Uint8Array>;
  readonly error?: string;
}

export class FarmClient {
  readonly #queue: Queue<FarmJobData, FarmJobResult>;
  readonly #events: QueueEvents;
  readonly #connections: Redis[];
  readonly #remote: HttpStore;
  readonly #options: FarmClientOptions;

  constructor(options: FarmClientOptions) {
    this.#options = options;
    this.#remote = new HttpStore(options.remoteCache);
    const name = options.queue ?? DEFAULT_QUEUE;
    // Our own connections (BullMQ leaves connections it did not create open): closed in close().
    this.#connections = [redisConnection(options.redis), redisConnection(options.redis)];
    this.#queue = new Queue<FarmJobData, FarmJobResult>(name, { connection: this.#connections[0]! });
    this.#events = new QueueEvents(name, { connection: this.#connections[1]! });
  }

  /** Uploads the inputs, enqueues one job per recipe and waits for all; results in recipe order. */
  async submit(recipes: readonly Recipe[]): Promise<FarmProbeResult[]> {
    await this.#events.waitUntilReady();
    const jobs: { id: string; probe: string }[] = [];
    for (const recipe of recipes) {
      const { input, ...rest } = recipe;
      if (input.faces !== undefined) throw new LightkilnError('INVALID_RECIPE', 'farm jobs take one input file (not six faces)');
      const bytes = input.bytes ?? (input.path !== undefined ? readFileSync(input.path) : undefined);
      if (bytes === undefined) throw new LightkilnError('INVALID_RECIPE', 'a recipe needs input.path or input.bytes');
      const name = input.name ?? (input.path !== undefined ? basename(input.path) : 'input');
      const digest = await this.#remote.putBlob(new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength));
      const data: FarmJobData = { recipe: rest, inputs: [{ name, digest, byteLength: bytes.length }], ...(input.layout !== undefined ? { layout: input.layout } : {}) };
      const id = jobIdFor(data);
      const probe = rest.name ?? name.replace(/\.[^.]*$/, '');
      // A job id that exists (queued, running or kept after completion) is not added twice.
      await this.#queue.add('bake', data, { jobId: id, attempts: 2, backoff: { type: 'fixed', delay: 1000 }, removeOnComplete: { age: 24 * 3600 }, removeOnFail: { age: 24 * 3600 } });
      jobs.push({ id, probe });
      this.#options.onSubmitted?.(probe, id);
    }
    const onProgress = this.#options.onProgress;
    const progressListener = ({ jobId, data }: { jobId: string; data: unknown }): void => {
      const job = jobs.find((j) => j.id === jobId);
      if (job !== undefined && onProgress !== undefined && typeof data === 'object' && data !== null) onProgress(job.probe, data as { stage: string; done: number; total: number });
    };
    this.#events.on('progress', progressListener);
    try {
      return await Promise.all(jobs.map((j) => this.#wait(j.id, j.probe)));
    } finally {
      this.#events.off('progress', progressListener);
    }
  }

  async #wait(id: string, probe: string): Promise<FarmProbeResult> {
    const job = await this.#queue.getJob(id);
    if (job === undefined) return { probe, ok: false, jobId: id, error: 'the job disappeared from the queue' };
    let result: FarmJobResult;
    try {
      result = await job.waitUntilFinished(this.#events, this.#options.jobTimeoutMs ?? 3_600_000);
    } catch (error) {
      return { probe, ok: false, jobId: id, error: error instanceof Error ? error.message : String(error) };
    }
    const files = new Map<string, Uint8Array>();
    for (const a of result.artifacts) {
      const bytes = await this.#remote.getBlob(a.sha256);
      if (bytes === undefined) return { probe: result.probe, ok: false, jobId: id, result, error: `artifact ${a.name} is missing from the shared cache or corrupt` };
      files.set(a.name, bytes);
    }
    return { probe: result.probe, ok: true, jobId: id, result, files };
  }

  async close(): Promise<void> {
    await this.#events.close();
    await this.#queue.close();
    for (const c of this.#connections) c.disconnect();
  }
}
