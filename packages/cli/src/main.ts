#!/usr/bin/env node
/**
 * The `lightkiln` command. An unchanged `lightkiln bake` (its stamp says every file it read and wrote is as
 * it left them, up-to-date.ts) replays its output before anything heavy is loaded; everything else goes
 * through dispatch.ts (exit codes 0 ok, 1 bake failed, 2 bad usage or input).
 */

import { upToDateOutput } from './up-to-date.js';

/** The value of --threads (undefined when absent: every core), or 0 when it is not a valid count (the bake reports it). */
function threadsFlag(argv: readonly string[]): number | undefined {
  let value: string | undefined;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '--threads') value = argv[i + 1];
    else if (a.startsWith('--threads=')) value = a.slice('--threads='.length);
  }
  if (value === undefined) return undefined;
  const n = Number(value);
  return Number.isInteger(n) && n >= 1 && n <= 256 ? n : 0;
}

async function main(argv: readonly string[]): Promise<number> {
  if (argv[0] === 'bake') {
    const replay = upToDateOutput(argv.slice(1));
    if (replay !== null) {
      process.stdout.write(replay);
      if (!argv.includes('--quiet')) process.stderr.write('lightkiln: up to date (every file read and written is as the last identical bake left it)\n');
      return 0;
    }
    // Workers start (and warm their kernels) while this thread loads the bake, reads and decodes.
    const threads = threadsFlag(argv);
    if (threads !== 0) (await import('@lightkiln/bake/warm')).warmSharedPool(threads);
  }
  const { runCommand } = await import('./dispatch.js');
  return runCommand(argv);
}

main(process.argv.slice(2)).then((code) => {
  process.exitCode = code;
});
