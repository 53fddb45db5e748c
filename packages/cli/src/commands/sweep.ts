/** `lightkiln sweep`: error against time for sample budgets and methods; CSV, Markdown, SVG and JSON. */

import { basename, join } from 'node:path';
import { refuseSymlink, sweepBudgets, writeFilesAtomic, sweepReport, SWEEP_METHODS, type SweepMethod } from '@lightkiln/bake';
import { parseArgs, UsageError } from '../args.js';
import { EXIT_OK, printJson, type CommandContext } from '../io.js';
import { createProgress } from '../progress.js';

const SPEC = {
  out: { type: 'string' }, size: { type: 'number' }, budgets: { type: 'string' }, methods: { type: 'string' }, repeats: { type: 'number' }, 'lod-bias': { type: 'number' }, rotate: { type: 'number' },
  threads: { type: 'number' }, name: { type: 'string' }, json: { type: 'boolean' }, quiet: { type: 'boolean' }, help: { type: 'boolean' },
} as const;

export async function sweepCommand(argv: readonly string[], ctx: CommandContext): Promise<number> {
  const { positionals, flags } = parseArgs('sweep', argv, SPEC);
  if (flags.help === true) return -1;
  if (positionals.length !== 1) throw new UsageError('sweep', 'give exactly one input file');
  const out = flags.out as string | undefined;
  if (out === undefined) throw new UsageError('sweep', 'missing --out <dir>');
  const budgets = flags.budgets === undefined ? undefined : String(flags.budgets).split(',').map((b) => {
    const t = b.trim();
    if (t === 'default') return 'default' as const;
    if (!/^\d+$/.test(t)) throw new UsageError('sweep', `--budgets takes numbers and "default", got "${t}"`);
    return Number(t);
  });
  const methods = flags.methods === undefined ? undefined : String(flags.methods).split(',').map((m) => {
    const t = m.trim() as SweepMethod;
    if (!SWEEP_METHODS.includes(t)) throw new UsageError('sweep', `--methods takes ${SWEEP_METHODS.join(', ')}, got "${t}"`);
    return t;
  });
  // Every output path is checked before the (long) sweep runs: a symbolic link there is refused.
  const probe = (flags.name as string | undefined) ?? (basename(positionals[0]!).replace(/\.[^.]*$/, '').replace(/[^A-Za-z0-9._-]/g, '_').replace(/^[.]+/, '') || 'probe');
  for (const ext of ['csv', 'md', 'svg', 'json']) refuseSymlink(join(out, `${probe}.sweep.${ext}`));
  refuseSymlink(out);
  const progress = createProgress({ quiet: ctx.quiet, label: 'lightkiln sweep' });
  try {
    const result = await sweepBudgets({
      recipe: { input: { path: positionals[0]! }, size: (flags.size as number | undefined) ?? 64, ...(flags['lod-bias'] !== undefined ? { lodBias: flags['lod-bias'] as number } : {}), ...(flags.rotate !== undefined ? { rotationDeg: flags.rotate as number } : {}), ...(flags.name !== undefined ? { name: flags.name as string } : {}), dfg: { enabled: false } },
      ...(budgets !== undefined ? { budgets } : {}),
      ...(methods !== undefined ? { methods } : {}),
      ...(flags.repeats !== undefined ? { repeats: flags.repeats as number } : {}),
      ...(flags.threads !== undefined ? { threads: flags.threads as number } : {}),
      signal: ctx.signal,
      onProgress: progress.onProgress,
    });
    progress.done();
    const report = sweepReport(result);
    const files = { csv: `${result.probe}.sweep.csv`, markdown: `${result.probe}.sweep.md`, svg: `${result.probe}.sweep.svg`, json: `${result.probe}.sweep.json` };
    const text = (t: string): Uint8Array => new TextEncoder().encode(t);
    writeFilesAtomic([
      { path: join(out, files.csv), bytes: text(report.csv) },
      { path: join(out, files.markdown), bytes: text(report.markdown) },
      { path: join(out, files.svg), bytes: text(report.svg) },
      { path: join(out, files.json), bytes: text(`${JSON.stringify(result, null, 2)}\n`) },
    ]);
    if (ctx.json) printJson(ctx, { artifacts: Object.entries(files).map(([kind, name]) => ({ kind: `sweep-${kind}`, path: join(out, name) })), summary: result.summary, points: result.points });
    else if (!ctx.quiet) ctx.stdout(report.markdown);
    return EXIT_OK;
  } finally {
    progress.done();
  }
}
