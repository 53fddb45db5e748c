/**
 * `lightkiln farm worker` and `lightkiln farm submit`: bakes spread over machines through a BullMQ queue
 * on Redis, inputs and results through the shared cache server (see @lightkiln/farm).
 */

import { join } from 'node:path';
import { LightkilnError, RemoteUnavailableError, writeFilesAtomic, type Recipe } from '@lightkiln/bake';
import { FarmClient, startFarmWorker } from '@lightkiln/farm';
import { parseArgs, UsageError } from '../args.js';
import { EXIT_FAILED, EXIT_OK, printJson, type CommandContext } from '../io.js';
import { BAKE_SPEC, preflight, recipesFromArgs } from './bake.js';

const FARM_FLAGS = { redis: { type: 'string' }, 'remote-cache': { type: 'string' }, queue: { type: 'string' } } as const;
const WORKER_SPEC = { ...FARM_FLAGS, threads: { type: 'number' }, 'lock-ms': { type: 'number' }, 'cache-dir': { type: 'string' }, json: { type: 'boolean' }, quiet: { type: 'boolean' }, help: { type: 'boolean' } } as const;
const { threads: _t, cache: _c, 'cache-dir': _cd, depfile: _d, 'remote-cache': _r, ...SUBMIT_BASE } = BAKE_SPEC;
const SUBMIT_SPEC = { ...SUBMIT_BASE, ...FARM_FLAGS } as const;

function required(flags: Record<string, unknown>, name: string, command: string): string {
  const v = flags[name];
  if (typeof v !== 'string' || v === '') throw new UsageError(command, `missing --${name} <url>`);
  return v;
}

export async function farmCommand(argv: readonly string[], ctx: CommandContext): Promise<number> {
  const [action, ...rest] = argv;
  if (action === 'worker') return farmWorker(rest, ctx);
  if (action === 'submit') return farmSubmit(rest, ctx);
  if (action === '--help' || action === undefined) return -1;
  throw new UsageError('farm', `unknown action "${action}" (worker or submit)`);
}

async function farmWorker(argv: readonly string[], ctx: CommandContext): Promise<number> {
  const { positionals, flags } = parseArgs('farm', argv, WORKER_SPEC);
  if (flags.help === true) return -1;
  if (positionals.length > 0) throw new UsageError('farm', 'farm worker takes no inputs');
  const log = (line: string): void => {
    if (!ctx.quiet) ctx.stderr(`lightkiln farm worker: ${line}\n`);
  };
  const worker = await startFarmWorker({
    redis: required(flags, 'redis', 'farm'),
    remoteCache: required(flags, 'remote-cache', 'farm'),
    ...(flags.queue !== undefined ? { queue: flags.queue as string } : {}),
    ...(flags.threads !== undefined ? { threads: flags.threads as number } : {}),
    ...(flags['cache-dir'] !== undefined ? { cacheDir: flags['cache-dir'] as string } : {}),
    ...(flags['lock-ms'] !== undefined ? { lockDurationMs: flags['lock-ms'] as number } : {}),
    log,
  });
  log(`ready (${worker.name}); stops on SIGINT or SIGTERM after the job in progress`);
  await new Promise<void>((resolve) => {
    if (ctx.signal.aborted) resolve();
    ctx.signal.addEventListener('abort', () => resolve(), { once: true });
  });
  await worker.close();
  log('stopped');
  return EXIT_OK;
}

async function farmSubmit(argv: readonly string[], ctx: CommandContext): Promise<number> {
  const { positionals, flags } = parseArgs('farm', argv, SUBMIT_SPEC);
  if (flags.help === true) return -1;
  const out = flags.out as string | undefined;
  if (out === undefined) throw new UsageError('farm', 'missing --out <dir>');
  const redis = required(flags, 'redis', 'farm');
  const remoteCache = required(flags, 'remote-cache', 'farm');
  const recipes: Recipe[] = recipesFromArgs('farm', positionals, flags);
  preflight(recipes, out, flags.batch as string | undefined);
  const lastShown = new Map<string, number>();
  // --events: JSON lines on stderr (the bake's progress and artifact events, plus `job` events:
  // state 'submitted' | 'completed' | 'failed', with worker, fromCache and ms on completion).
  const events = flags.events === true;
  const start = performance.now();
  const emit = (probe: string, event: Record<string, unknown>): void => {
    if (events) ctx.stderr(`${JSON.stringify({ t: Math.round(performance.now() - start), probe, ...event })}\n`);
  };
  const client = new FarmClient({
    redis, remoteCache,
    ...(flags.queue !== undefined ? { queue: flags.queue as string } : {}),
    onSubmitted: (probe, jobId) => emit(probe, { type: 'job', state: 'submitted', jobId }),
    onProgress: (probe, p) => {
      if (events) {
        emit(probe, { type: 'progress', stage: p.stage, done: p.done, total: p.total });
        return;
      }
      if (ctx.quiet) return;
      const now = Date.now();
      if (now - (lastShown.get(probe) ?? 0) < 500) return;
      lastShown.set(probe, now);
      ctx.stderr(`lightkiln farm: ${probe}: ${p.stage} ${p.total > 0 ? Math.round((100 * p.done) / p.total) : 0}%\n`);
    },
  });
  let results;
  try {
    results = await client.submit(recipes);
  } catch (error) {
    if (error instanceof RemoteUnavailableError) throw new LightkilnError('IO_ERROR', `the shared cache cannot take the inputs: ${error.message}`);
    throw error;
  } finally {
    await client.close();
  }
  const artifacts: { kind: string; path: string; sha256: string; probe: string }[] = [];
  const probes: Record<string, unknown>[] = [];
  let failed = 0;
  for (const r of results) {
    if (!r.ok || r.result === undefined || r.files === undefined) {
      failed++;
      probes.push({ probe: r.probe, ok: false, error: { code: 'BAKE_FAILED', message: r.error ?? 'failed' } });
      emit(r.probe, { type: 'job', state: 'failed', message: r.error ?? 'failed' });
      if (!ctx.quiet && !events) ctx.stderr(`lightkiln farm: error: ${r.probe}: ${r.error ?? 'failed'}\n`);
      continue;
    }
    writeFilesAtomic(r.result.artifacts.map((a) => ({ path: join(out, a.name), bytes: r.files!.get(a.name)! })));
    emit(r.probe, { type: 'job', state: 'completed', worker: r.result.worker, fromCache: r.result.fromCache, ms: r.result.ms });
    for (const a of r.result.artifacts) {
      artifacts.push({ kind: a.kind, path: join(out, a.name), sha256: a.sha256, probe: r.probe });
      emit(r.probe, { type: 'artifact', kind: a.kind, name: a.name, path: join(out, a.name), sha256: a.sha256, bytes: r.files!.get(a.name)!.length, written: true, fromCache: r.result.fromCache });
    }
    probes.push({ probe: r.probe, ok: true, ms: r.result.ms, worker: r.result.worker, fromCache: r.result.fromCache });
    if (!ctx.quiet && !events) ctx.stderr(`lightkiln farm: ${r.probe} done on ${r.result.worker}${r.result.fromCache ? ' (from cache)' : ''}\n`);
  }
  if (ctx.json) printJson(ctx, { artifacts, probes, failed });
  else if (!ctx.quiet) for (const a of artifacts) ctx.stdout(`${a.kind.padEnd(10)} ${a.path}\n`);
  return failed === 0 ? EXIT_OK : EXIT_FAILED;
}
