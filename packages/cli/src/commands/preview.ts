/** `lightkiln preview`: the contact sheet of a baked probe, from its manifest. */

import { randomBytes } from 'node:crypto';
import { mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { LightkilnError, previewFromManifest } from '@lightkiln/bake';
import { parseArgs, UsageError } from '../args.js';
import { EXIT_OK, printJson, type CommandContext } from '../io.js';

const SPEC = { out: { type: 'string' }, exposure: { type: 'number' }, json: { type: 'boolean' }, quiet: { type: 'boolean' }, help: { type: 'boolean' } } as const;

export async function previewCommand(argv: readonly string[], ctx: CommandContext): Promise<number> {
  const { positionals, flags } = parseArgs('preview', argv, SPEC);
  if (flags.help === true) return -1;
  if (positionals.length !== 1) throw new UsageError('preview', 'give exactly one <probe>.probe.json');
  const out = flags.out as string | undefined;
  if (out === undefined || !out.endsWith('.png')) throw new UsageError('preview', 'missing --out <file.png>');
  const png = previewFromManifest(positionals[0]!, (flags.exposure as number | undefined) ?? 0);
  mkdirSync(dirname(out), { recursive: true });
  const tmp = join(dirname(out), `.${basename(out)}.tmp-${process.pid}-${randomBytes(4).toString('hex')}`);
  try {
    writeFileSync(tmp, png);
    renameSync(tmp, out);
  } catch (error) {
    rmSync(tmp, { force: true });
    throw new LightkilnError('IO_ERROR', `${out}: cannot write (${(error as { code?: string }).code ?? String(error)})`, { file: out });
  }
  if (ctx.json) printJson(ctx, { artifacts: [{ kind: 'preview', path: out, byteLength: png.length }] });
  else if (!ctx.quiet) ctx.stdout(`preview    ${out}\n`);
  return EXIT_OK;
}
