/** `lightkiln lut`: the DFG lookup table alone, written atomically. */

import { createBaker, writeFilesAtomic } from '@lightkiln/bake';
import { parseArgs, UsageError } from '../args.js';
import { EXIT_OK, printJson, type CommandContext } from '../io.js';
import { createProgress } from '../progress.js';
import { bakerOptions } from './bake.js';

const SPEC = {
  out: { type: 'string' }, size: { type: 'number' }, samples: { type: 'number' }, multiscatter: { type: 'boolean' }, cloth: { type: 'boolean' },
  zlib: { type: 'boolean' }, zstd: { type: 'boolean' }, threads: { type: 'number' }, cache: { type: 'boolean' }, 'cache-dir': { type: 'string' }, json: { type: 'boolean' },
  quiet: { type: 'boolean' }, help: { type: 'boolean' },
} as const;

export async function lutCommand(argv: readonly string[], ctx: CommandContext): Promise<number> {
  const { positionals, flags } = parseArgs('lut', argv, SPEC);
  if (flags.help === true) return -1;
  if (positionals.length > 0) throw new UsageError('lut', `unexpected argument "${positionals[0]}"`);
  const out = flags.out as string | undefined;
  if (out === undefined) throw new UsageError('lut', 'missing --out <file.ktx2>');
  if (!out.endsWith('.ktx2')) throw new UsageError('lut', '--out must name a .ktx2 file');
  const baker = createBaker(bakerOptions(flags));
  const progress = createProgress({ quiet: ctx.quiet, label: 'lightkiln' });
  try {
    const lut = await baker.lut({
      ...(flags.size !== undefined ? { size: flags.size as number } : {}),
      ...(flags.samples !== undefined ? { samples: flags.samples as number } : {}),
      multiscatter: flags.multiscatter === true,
      cloth: flags.cloth === true,
      supercompression: flags.zstd === true ? 'zstd' : flags.zlib === true ? 'zlib' : 'none',
    }, { signal: ctx.signal, onProgress: progress.onProgress });
    writeFilesAtomic([{ path: out, bytes: lut.bytes }]);
    progress.done();
    if (ctx.json) printJson(ctx, { artifacts: [{ kind: 'lut', path: out, sha256: lut.sha256, format: lut.format }] });
    else if (!ctx.quiet) ctx.stdout(`lut        ${out}\n`);
    return EXIT_OK;
  } finally {
    progress.done();
    await baker.close();
  }
}
