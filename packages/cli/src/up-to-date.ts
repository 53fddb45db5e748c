/**
 * The CLI's no-op fast path for `lightkiln bake`: after a successful bake the command leaves a stamp in the
 * cache folder (`stamps/<id>.stamp`, id = the command line, working folder, tool and stage versions)
 * holding the state (size, modification time in ns, inode) of every file it read and wrote, the depfile
 * text and what it printed. The next identical command whose files all still have those states is up to
 * date: it replays the output without loading the bake (module loading alone costs more than the whole
 * check), as make and git decide on file metadata. Any difference, a missing stamp or an option that asks
 * for live output (--json, --events) takes the ordinary path, which reads the content-hash cache.
 *
 * Only node built-ins and the constants of `@lightkiln/bake/version` are imported here: this runs before
 * anything else is loaded.
 */

import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { CACHE_MARKER_NAME, STAGE_VERSIONS, TOOL_VERSION } from '@lightkiln/bake/version';

export const STAMP_FOLDER = 'stamps';

export interface FileState {
  readonly path: string;
  readonly size: string;
  readonly mtimeNs: string;
  readonly ino: string;
}

export interface Stamp {
  readonly reads: readonly FileState[];
  readonly writes: readonly FileState[];
  readonly depfile: { readonly path: string; readonly text: string } | null;
  readonly stdout: string;
}

/** The state of a file now, or null when it is missing or not a regular file. */
export function fileState(path: string): FileState | null {
  try {
    const st = statSync(path, { bigint: true });
    if (!st.isFile()) return null;
    return { path, size: String(st.size), mtimeNs: String(st.mtimeNs), ino: String(st.ino) };
  } catch {
    return null;
  }
}

const same = (a: FileState, b: FileState | null): boolean => b !== null && a.size === b.size && a.mtimeNs === b.mtimeNs && a.ino === b.ino;

/** Where a bake command line keeps its stamp, or null when it takes no fast path (no cache, live output). */
export function stampPath(argv: readonly string[], cwd: string = process.cwd()): string | null {
  let cacheDir = '.lightkiln-cache';
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '--no-cache' || a === '--json' || a === '--events' || a === '--help') return null;
    if (a === '--cache-dir' && i + 1 < argv.length) cacheDir = argv[i + 1]!;
    else if (a.startsWith('--cache-dir=')) cacheDir = a.slice('--cache-dir='.length);
  }
  const folder = resolve(cwd, cacheDir);
  const id = createHash('sha256').update(JSON.stringify({ argv, cwd, tool: TOOL_VERSION, stages: STAGE_VERSIONS })).digest('hex');
  return join(folder, STAMP_FOLDER, `${id}.stamp`);
}

/** The output to replay when the command's stamp says it is up to date; null otherwise. */
export function upToDateOutput(argv: readonly string[]): string | null {
  const path = stampPath(argv);
  if (path === null) return null;
  // Only inside a folder that is a lightkiln cache (its marker).
  if (!existsSync(join(path, '..', '..', CACHE_MARKER_NAME))) return null;
  let stamp: Stamp;
  try {
    stamp = JSON.parse(readFileSync(path, 'utf8')) as Stamp;
  } catch {
    return null;
  }
  if (!Array.isArray(stamp.reads) || !Array.isArray(stamp.writes) || typeof stamp.stdout !== 'string') return null;
  for (const f of [...stamp.reads, ...stamp.writes]) if (!same(f, fileState(f.path))) return null;
  if (stamp.depfile !== null) {
    // Build systems may delete a depfile once read (Ninja's deps = gcc): write it again, atomically.
    let current: string | null = null;
    try {
      current = readFileSync(stamp.depfile.path, 'utf8');
    } catch {
      current = null;
    }
    if (current !== stamp.depfile.text) {
      const temp = `${stamp.depfile.path}.${process.pid}.lightkiln-tmp`;
      try {
        writeFileSync(temp, stamp.depfile.text);
        renameSync(temp, stamp.depfile.path);
      } catch {
        rmSync(temp, { force: true });
        return null;
      }
    }
  }
  return stamp.stdout;
}

/**
 * Records a finished bake. `readsBefore` are the states of the files read, taken before the bake: if any
 * changed while it ran, no stamp is written (the next run must look again).
 */
export function writeStamp(argv: readonly string[], readsBefore: readonly FileState[], writes: readonly string[], depfile: Stamp['depfile'], stdout: string): void {
  const path = stampPath(argv);
  if (path === null) return;
  if (!existsSync(join(path, '..', '..', CACHE_MARKER_NAME))) return;
  const reads: FileState[] = [];
  for (const before of readsBefore) {
    const now = fileState(before.path);
    if (!same(before, now)) return;
    reads.push(now!);
  }
  const written: FileState[] = [];
  for (const w of writes) {
    const s = fileState(w);
    if (s === null) return;
    written.push(s);
  }
  const stamp: Stamp = { reads, writes: written, depfile, stdout };
  const temp = `${path}.${process.pid}.lightkiln-tmp`;
  try {
    mkdirSync(join(path, '..'), { recursive: true });
    writeFileSync(temp, JSON.stringify(stamp));
    renameSync(temp, path);
  } catch {
    // A stamp is an optimisation: a folder we cannot write leaves the ordinary path.
    rmSync(temp, { force: true });
  }
}
