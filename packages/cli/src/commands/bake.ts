/** `lightkiln bake`: one or many inputs, or a batch file, sharing one pool; failures reported per probe. */

import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, isAbsolute, join, resolve } from 'node:path';
import { createBaker, LightkilnError, refuseSymlink, resolveRecipe, writeFilesAtomic, type BakeEvent, type BakerOptions, type Recipe } from '@lightkiln/bake';
import { depfileText } from '../depfile.js';
import { parseArgs, UsageError } from '../args.js';
import { EXIT_FAILED, EXIT_OK, EXIT_USAGE, printJson, type CommandContext } from '../io.js';
import { createProgress } from '../progress.js';
import { fileState, writeStamp, type FileState } from '../up-to-date.js';

export const BAKE_SPEC = {
  out: { type: 'string' }, size: { type: 'number' }, levels: { type: 'number' }, samples: { type: 'string' },
  rotate: { type: 'number' }, format: { type: 'string' }, 'irradiance-size': { type: 'number' }, filtered: { type: 'boolean' },
  zlib: { type: 'boolean' }, zstd: { type: 'boolean' }, views: { type: 'boolean' }, preview: { type: 'boolean' }, name: { type: 'string' }, recipe: { type: 'string' }, batch: { type: 'string' }, depfile: { type: 'string' }, events: { type: 'boolean' }, 'remote-cache': { type: 'string' },
  threads: { type: 'number' }, cache: { type: 'boolean' }, 'cache-dir': { type: 'string' }, json: { type: 'boolean' }, quiet: { type: 'boolean' },
  help: { type: 'boolean' },
} as const;

export function bakerOptions(flags: Record<string, unknown>): BakerOptions {
  const cacheOff = flags.cache === false;
  if (cacheOff && flags['cache-dir'] !== undefined) throw new UsageError('bake', '--no-cache and --cache-dir exclude each other');
  const remote = flags['remote-cache'] as string | undefined;
  if (cacheOff && remote !== undefined) throw new UsageError('bake', '--no-cache and --remote-cache exclude each other');
  return {
    ...(flags.threads !== undefined ? { threads: flags.threads as number } : {}),
    cache: cacheOff ? false : ((flags['cache-dir'] as string | undefined) ?? '.lightkiln-cache'),
    ...(remote !== undefined ? { remoteCache: remote, onWarning: (m: string) => process.stderr.write(`lightkiln: warning: ${m}\n`) } : {}),
  };
}

function readJson(path: string, what: string): unknown {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    throw new LightkilnError('INVALID_INPUT', `${path}: cannot read the ${what} (${(error as { code?: string }).code ?? 'error'})`, { file: path });
  }
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new LightkilnError('INVALID_INPUT', `${path}: the ${what} is not valid JSON (${(error as Error).message})`, { file: path });
  }
}

function flagRecipe(flags: Record<string, unknown>): Partial<Recipe> {
  const samples = flags.samples as string | undefined;
  let parsedSamples: Recipe['samples'] | undefined;
  if (samples !== undefined) {
    if (/^\d+$/.test(samples)) parsedSamples = Number(samples);
    else if (samples === 'draft' || samples === 'default' || samples === 'high') parsedSamples = samples;
    else throw new UsageError('bake', `--samples must be draft, default, high or a number, got "${samples}"`);
  }
  const output: Record<string, unknown> = {};
  if (flags.format !== undefined) output.specularFormat = flags.format;
  if (flags.zlib === true && flags.zstd === true) throw new UsageError('bake', '--zlib and --zstd exclude each other');
  if (flags.zlib === true) output.supercompression = 'zlib';
  if (flags.zstd === true) output.supercompression = 'zstd';
  if (flags.views === true) output.views = ['hdr'];
  if (flags.preview === true) output.preview = true;
  return {
    ...(flags.size !== undefined ? { size: flags.size as number } : {}),
    ...(flags.levels !== undefined ? { levels: flags.levels as number } : {}),
    ...(parsedSamples !== undefined ? { samples: parsedSamples } : {}),
    ...(flags.rotate !== undefined ? { rotationDeg: flags.rotate as number } : {}),
    ...(flags.filtered === false ? { filtered: false } : {}),
    ...(flags['irradiance-size'] !== undefined ? { irradiance: { cubeSize: flags['irradiance-size'] as number } } : {}),
    ...(Object.keys(output).length > 0 ? { output: output as Recipe['output'] } : {}),
  };
}

/** Merges base recipe fields with flag fields (one level deep for the nested groups). */
function merge(base: Record<string, unknown>, over: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = { ...base };
  for (const [k, v] of Object.entries(over)) {
    const b = out[k];
    out[k] = typeof v === 'object' && v !== null && !Array.isArray(v) && typeof b === 'object' && b !== null && !Array.isArray(b) ? { ...b, ...v } : v;
  }
  return out;
}

/** The input files a recipe reads (path or six faces). */
function inputPaths(recipe: Recipe): string[] {
  const input = recipe.input as { path?: string; faces?: string[] } | undefined;
  return [...(input?.path !== undefined ? [input.path] : []), ...(input?.faces ?? [])];
}

/**
 * Every check that needs no decoding runs before any bake: each recipe resolves, inputs exist and are
 * files, probe names are unique (two entries would write the same files), the output folder and any
 * existing file of a probe there are not symbolic links. One bad entry stops the whole batch before work.
 */
export function preflight(recipes: readonly Recipe[], out: string, batchPath: string | undefined): void {
  const where = (i: number): string => (batchPath === undefined ? '' : `${batchPath}: entry ${i}: `);
  refuseSymlink(out);
  let existing: string[] = [];
  try {
    existing = readdirSync(out);
  } catch {
    // not there yet
  }
  const seen = new Map<string, number>();
  recipes.forEach((raw, i) => {
    let name: string;
    let paths: string[];
    try {
      const r = resolveRecipe(raw);
      name = r.name;
      const input = raw.input as { path?: string; faces?: string[] } | undefined;
      paths = [...(input?.path !== undefined ? [input.path] : []), ...(input?.faces ?? [])];
    } catch (error) {
      if (error instanceof LightkilnError) throw new LightkilnError(error.code, `${where(i)}${error.message}`, { ...(error.file !== undefined ? { file: error.file } : {}), cause: error });
      throw error;
    }
    for (const path of paths) {
      let ok = false;
      try {
        ok = statSync(path).isFile();
      } catch {
        ok = false;
      }
      if (!ok) throw new LightkilnError('INVALID_INPUT', `${where(i)}${path}: no such input file`, { file: path });
    }
    const first = seen.get(name);
    if (first !== undefined) throw new LightkilnError('INVALID_RECIPE', `${where(i)}probe name "${name}" is also used by entry ${first}; names must be unique (set "name")`);
    seen.set(name, i);
    for (const file of existing) if (file.startsWith(`${name}.`)) refuseSymlink(join(out, file));
  });
}

/**
 * The recipes of a bake or farm submission: input files or a batch file, a base recipe file, flags on top.
 */
export function recipesFromArgs(command: string, positionals: readonly string[], flags: Record<string, unknown>): Recipe[] {
  if (positionals.length === 0 && flags.batch === undefined) throw new UsageError(command, 'give at least one input file or --batch <file>');
  if (positionals.length > 0 && flags.batch !== undefined) throw new UsageError(command, 'give input files or --batch, not both');
  if (flags.name !== undefined && positionals.length !== 1) throw new UsageError(command, '--name needs exactly one input');
  const base = flags.recipe !== undefined ? readJson(flags.recipe as string, 'recipe') : {};
  if (typeof base !== 'object' || base === null || Array.isArray(base)) throw new LightkilnError('INVALID_RECIPE', `${String(flags.recipe)}: a recipe file holds one JSON object`);
  const fromFlags = flagRecipe(flags);
  let recipes: Recipe[];
  if (flags.batch !== undefined) {
    const batchPath = flags.batch as string;
    const list = readJson(batchPath, 'batch file');
    if (!Array.isArray(list)) throw new LightkilnError('INVALID_RECIPE', `${batchPath}: a batch file holds a JSON list of recipes`);
    const root = dirname(batchPath);
    recipes = list.map((item, i) => {
      if (typeof item !== 'object' || item === null) throw new LightkilnError('INVALID_RECIPE', `${batchPath}: entry ${i} is not an object`);
      const r = merge(merge(base as Record<string, unknown>, item as Record<string, unknown>), fromFlags as Record<string, unknown>) as unknown as Recipe;
      const input = r.input as { path?: string; faces?: string[] } | undefined;
      const fix = (p: string): string => (isAbsolute(p) ? p : resolve(root, p));
      return { ...r, input: { ...input, ...(input?.path !== undefined ? { path: fix(input.path) } : {}), ...(input?.faces !== undefined ? { faces: input.faces.map(fix) } : {}) } } as Recipe;
    });
  } else {
    recipes = positionals.map((path) => merge(merge(base as Record<string, unknown>, fromFlags as Record<string, unknown>), {
      input: { path }, ...(flags.name !== undefined ? { name: flags.name } : {}),
    }) as unknown as Recipe);
  }
  return recipes;
}

export async function bakeCommand(argv: readonly string[], ctx: CommandContext): Promise<number> {
  const { positionals, flags } = parseArgs('bake', argv, BAKE_SPEC);
  if (flags.help === true) return -1;
  const out = flags.out as string | undefined;
  if (out === undefined) throw new UsageError('bake', 'missing --out <dir>');
  const recipes = recipesFromArgs('bake', positionals, flags);
  preflight(recipes, out, flags.batch as string | undefined);
  // Every file the bake reads (depfile prerequisites, and the up-to-date stamp's reads, taken now).
  const read = [...(flags.recipe !== undefined ? [flags.recipe as string] : []), ...(flags.batch !== undefined ? [flags.batch as string] : []), ...recipes.flatMap(inputPaths)];
  const readStates = read.map(fileState);
  const baker = createBaker(bakerOptions(flags));
  // --events: one JSON object per line on stderr instead of the progress display (schema: bake's events.ts).
  const events = flags.events === true;
  const eventsStart = performance.now();
  const progress = createProgress({ quiet: ctx.quiet || events, label: 'lightkiln' });
  const results: Record<string, unknown>[] = [];
  const artifacts: { kind: string; path: string; sha256: string; probe: string }[] = [];
  let failed = 0;
  let userFailures = 0;
  try {
    for (const recipe of recipes) {
      const label = (recipe.input as { path?: string } | undefined)?.path ?? recipe.name ?? 'probe';
      if (ctx.signal.aborted) break;
      try {
        const started = performance.now();
        const probe = resolveRecipe(recipe).name;
        const onEvent = events ? (event: BakeEvent): void => ctx.stderr(`${JSON.stringify({ t: Math.round(performance.now() - eventsStart), probe, ...event })}\n`) : undefined;
        const result = await baker.bake(recipe, { outDir: out, signal: ctx.signal, onProgress: progress.onProgress, ...(onEvent !== undefined ? { onEvent } : {}) });
        for (const a of result.artifacts) artifacts.push({ kind: a.kind, path: a.path!, sha256: a.sha256, probe: result.manifest.probe });
        const ms = performance.now() - started;
        results.push({ input: label, probe: result.manifest.probe, ok: true, ms: Math.round(ms), cache: result.cache });
        progress.log(`baked ${result.manifest.probe} in ${(ms / 1000).toFixed(2)} s (${result.artifacts.filter((a) => a.fromCache).length} of ${result.artifacts.length - 1} files from cache)`);
      } catch (error) {
        const e = error instanceof LightkilnError ? error : new LightkilnError('BAKE_FAILED', String(error));
        failed++;
        if (e.isUserError) userFailures++;
        results.push({ input: label, ok: false, error: { code: e.code, message: e.message } });
        progress.log(`error: ${e.message}`);
        if (e.code === 'ABORTED') break;
      }
    }
  } finally {
    progress.done();
    await baker.close();
  }
  const depfile = flags.depfile as string | undefined;
  if (depfile !== undefined) {
    // Targets: every artifact of the probes that baked (paths as the bake wrote them, from --out as
    // passed); prerequisites: every file read.
    writeFilesAtomic([{ path: depfile, bytes: new TextEncoder().encode(depfileText(artifacts.map((a) => a.path), read)) }]);
  }
  if (ctx.json) printJson(ctx, { artifacts, probes: results, failed });
  const listing = ctx.json || ctx.quiet ? '' : artifacts.map((a) => `${a.kind.padEnd(10)} ${a.path}\n`).join('');
  if (listing !== '') ctx.stdout(listing);
  if (failed === 0) {
    // The next identical command can skip all of this while every file read and written is unchanged.
    if (!ctx.json && !events && !ctx.signal.aborted && readStates.every((st) => st !== null)) {
      const depfileRecord = depfile === undefined ? null : { path: depfile, text: readFileSync(depfile, "utf8") };
      writeStamp(argv, readStates as FileState[], artifacts.map((a) => a.path), depfileRecord, listing);
    }
    return EXIT_OK;
  }
  // A single probe that failed on bad input is a usage/input error; any other failure is a bake failure.
  return recipes.length === 1 && userFailures === 1 ? EXIT_USAGE : EXIT_FAILED;
}
