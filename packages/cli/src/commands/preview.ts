/** `lightkiln preview`: the contact sheet of a baked probe, from its manifest. */

import { previewFromManifest, writeFilesAtomic } from '@lightkiln/bake';
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
  writeFilesAtomic([{ path: out, bytes: png }]);
  if (ctx.json) printJson(ctx, { artifacts: [{ kind: 'preview', path: out, byteLength: png.length }] });
  else if (!ctx.quiet) ctx.stdout(`preview    ${out}\n`);
  return EXIT_OK;
}
