/** The `lightkiln` commands: dispatch, exit codes (0 ok, 1 bake failed, 2 bad usage or input), Ctrl-C. */

import { closeSharedPools, LightkilnError, removeLiveTempFiles, TOOL_NAME, TOOL_VERSION } from '@lightkiln/bake';
import { UsageError } from './args.js';
import { bakeCommand } from './commands/bake.js';
import { cacheCommand } from './commands/cache.js';
import { inspectCommand } from './commands/inspect.js';
import { lutCommand } from './commands/lut.js';
import { previewCommand } from './commands/preview.js';
import { sweepCommand } from './commands/sweep.js';
import { EXIT_FAILED, EXIT_OK, EXIT_USAGE, type CommandContext } from './io.js';
import { USAGE } from './usage.js';

const COMMANDS: Record<string, (argv: readonly string[], ctx: CommandContext) => Promise<number>> = {
  bake: bakeCommand,
  lut: lutCommand,
  inspect: inspectCommand,
  cache: cacheCommand,
  preview: previewCommand,
  sweep: sweepCommand,
  // Loaded on use: the queue client (bullmq, ioredis) is heavy for every other command's start-up.
  farm: async (argv, ctx) => (await import('./commands/farm.js')).farmCommand(argv, ctx),
};

export async function runCommand(argv: readonly string[]): Promise<number> {
  const [command, ...rest] = argv;
  const controller = new AbortController();
  // SIGINT and SIGTERM alike: stop the work, remove this process's temp files, exit with the failure code.
  // A second signal exits at once (temp files are still removed).
  const onSignal = (name: NodeJS.Signals): void => {
    if (controller.signal.aborted) {
      removeLiveTempFiles();
      process.exit(EXIT_FAILED);
    }
    process.stderr.write(`\ninterrupted (${name}): stopping (no partial outputs are left)\n`);
    controller.abort(new Error(name));
  };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  const ctx: CommandContext = {
    json: rest.includes('--json'),
    quiet: rest.includes('--quiet'),
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    signal: controller.signal,
  };
  try {
    if (command === undefined || command === '--help' || command === 'help' || command === '-h') {
      process.stdout.write(`${USAGE.main}\n`);
      return command === undefined ? EXIT_USAGE : EXIT_OK;
    }
    if (command === '--version') {
      process.stdout.write(`${TOOL_NAME} ${TOOL_VERSION}\n`);
      return EXIT_OK;
    }
    const run = COMMANDS[command];
    if (run === undefined) throw new UsageError('main', `unknown command "${command}"`);
    const code = await run(rest, ctx);
    if (code === -1) {
      process.stdout.write(`${USAGE[command]}\n`);
      return EXIT_OK;
    }
    return code;
  } catch (error) {
    if (error instanceof UsageError) {
      process.stderr.write(`lightkiln ${error.command === 'main' ? '' : `${error.command}: `}${error.message}\n\n${USAGE[error.command] ?? USAGE.main}\n`);
      if (ctx.json) process.stdout.write(`${JSON.stringify({ artifacts: [], error: { code: 'USAGE', message: error.message } }, null, 2)}\n`);
      return EXIT_USAGE;
    }
    if (error instanceof LightkilnError) {
      process.stderr.write(`lightkiln: error: ${error.message}\n`);
      if (ctx.json) process.stdout.write(`${JSON.stringify({ artifacts: [], error: { code: error.code, message: error.message } }, null, 2)}\n`);
      return error.isUserError ? EXIT_USAGE : EXIT_FAILED;
    }
    process.stderr.write(`lightkiln: internal error: ${error instanceof Error ? error.message : String(error)}\n`);
    if (ctx.json) process.stdout.write(`${JSON.stringify({ artifacts: [], error: { code: 'INTERNAL', message: error instanceof Error ? error.message : String(error) } }, null, 2)}\n`);
    return EXIT_FAILED;
  } finally {
    removeLiveTempFiles();
    process.off('SIGINT', onSignal);
    process.off('SIGTERM', onSignal);
    await closeSharedPools();
  }
}
