/** Output helpers shared by the commands. */

export interface CommandContext {
  readonly json: boolean;
  readonly quiet: boolean;
  readonly stdout: (text: string) => void;
  readonly stderr: (text: string) => void;
  readonly signal: AbortSignal;
}

/** Exit codes of the CLI contract (README, Conventions). */
export const EXIT_OK = 0;
export const EXIT_FAILED = 1;
export const EXIT_USAGE = 2;

export function printJson(ctx: CommandContext, value: unknown): void {
  ctx.stdout(`${JSON.stringify(value, null, 2)}\n`);
}
