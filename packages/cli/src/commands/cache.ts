/** `lightkiln cache stats|verify|prune|clear`. */

import { decodeEntry, FolderStore, notACache, pruneStore } from '@lightkiln/bake';
import { parseArgs, UsageError } from '../args.js';
import { EXIT_FAILED, EXIT_OK, printJson, type CommandContext } from '../io.js';

const SPEC = { 'cache-dir': { type: 'string' }, 'max-bytes': { type: 'number' }, json: { type: 'boolean' }, quiet: { type: 'boolean' }, help: { type: 'boolean' } } as const;

export async function cacheCommand(argv: readonly string[], ctx: CommandContext): Promise<number> {
  const { positionals, flags } = parseArgs('cache', argv, SPEC);
  if (flags.help === true) return -1;
  const action = positionals[0];
  if (action === undefined || !['stats', 'verify', 'prune', 'clear'].includes(action) || positionals.length > 1) {
    throw new UsageError('cache', action === undefined ? 'missing action' : `unknown action "${positionals.slice(0).join(' ')}"`);
  }
  const dir = (flags['cache-dir'] as string | undefined) ?? '.lightkiln-cache';
  const store = new FolderStore(dir);
  // Only a folder that carries the cache marker is ever changed (stats alone reads any folder).
  if (action !== 'stats' && !store.isCache()) throw notACache(dir);
  const entries = await store.entries();
  const total = entries.reduce((n, e) => n + e.size, 0);
  let report: Record<string, unknown>;
  let code = EXIT_OK;
  if (action === 'stats') {
    const oldest = entries.length > 0 ? new Date(Math.min(...entries.map((e) => e.lastUsed))).toISOString() : null;
    const temps = store.sweepTemps(true);
    report = { dir, entries: entries.length, bytes: total, leastRecentlyUsed: oldest, staleTempFiles: temps.files, staleTempBytes: temps.bytes };
  } else if (action === 'verify') {
    const corrupt: string[] = [];
    for (const e of entries) {
      const bytes = await store.get(e.key);
      if (bytes === undefined || decodeEntry(bytes, e.key) === null) {
        corrupt.push(e.key);
        await store.delete(e.key);
      }
    }
    const temps = store.sweepTemps(false);
    report = { dir, entries: entries.length, corrupt: corrupt.length, removed: corrupt.length, corruptEntries: corrupt, staleTempFilesRemoved: temps.files };
    if (corrupt.length > 0) code = EXIT_FAILED;
  } else if (action === 'prune') {
    const max = flags['max-bytes'] as number | undefined;
    if (max === undefined || max < 0) throw new UsageError('cache', 'prune needs --max-bytes N (N >= 0)');
    const temps = store.sweepTemps(false);
    report = { dir, ...(await pruneStore(store, max)), staleTempFilesRemoved: temps.files };
  } else {
    report = { dir, ...store.clear() };
  }
  if (ctx.json) printJson(ctx, report);
  else ctx.stdout(`${Object.entries(report).map(([k, v]) => `${k}: ${Array.isArray(v) ? (v.length === 0 ? '-' : `\n  ${v.join('\n  ')}`) : String(v)}`).join('\n')}\n`);
  return code;
}
