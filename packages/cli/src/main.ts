#!/usr/bin/env node
/**
 * The `lightkiln` command. An unchanged `lightkiln bake` (its stamp says every file it read and wrote is as
 * it left them, up-to-date.ts) replays its output before anything heavy is loaded; everything else goes
 * through dispatch.ts (exit codes 0 ok, 1 bake failed, 2 bad usage or input).
 */

import { upToDateOutput } from './up-to-date.js';

async function main(argv: readonly string[]): Promise<number> {
  if (argv[0] === 'bake') {
    const replay = upToDateOutput(argv.slice(1));
    if (replay !== null) {
      process.stdout.write(replay);
      if (!argv.includes('--quiet')) process.stderr.write('lightkiln: up to date (every file read and written is as the last identical bake left it)\n');
      return 0;
    }
  }
  const { runCommand } = await import('./dispatch.js');
  return runCommand(argv);
}

main(process.argv.slice(2)).then((code) => {
  process.exitCode = code;
});
