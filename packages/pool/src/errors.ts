/** Typed errors of the pool. Every error carries a string `code`; the bake maps them onto its own. */

export type PoolErrorCode = 'ABORTED' | 'KERNEL_FAILED' | 'WORKER_DIED' | 'POOL_CLOSED' | 'INVALID_JOB' | 'KERNEL_NOT_FOUND';

export class PoolError extends Error {
  readonly code: PoolErrorCode;
  readonly kernel: string | undefined;
  readonly tile: TileDescription | undefined;

  constructor(code: PoolErrorCode, message: string, options: { cause?: unknown; kernel?: string; tile?: TileDescription } = {}) {
    super(message, options.cause === undefined ? undefined : { cause: options.cause });
    this.name = 'PoolError';
    this.code = code;
    this.kernel = options.kernel;
    this.tile = options.tile;
  }
}

/** Where a failing tile lies, for messages: its segment label and item range. */
export interface TileDescription {
  readonly segment: number;
  readonly label: string;
  readonly begin: number;
  readonly end: number;
}

export function abortedError(reason?: unknown): PoolError {
  return new PoolError('ABORTED', 'the job was aborted', { cause: reason });
}

export function poolClosedError(): PoolError {
  return new PoolError('POOL_CLOSED', 'the worker pool was closed while the job was running');
}

export function invalidJobError(reason: string): PoolError {
  return new PoolError('INVALID_JOB', `invalid pool job: ${reason}`);
}

const WORKER_DEATH = /worker (exited|terminated)|terminated|exit code|out of memory|ERR_WORKER/i;

/** Maps a rejection of one tile onto a PoolError naming the kernel and tile. */
export function tileFailedError(kernel: string, tile: TileDescription, cause: unknown): PoolError {
  if (cause instanceof PoolError) return cause;
  const message = cause instanceof Error ? cause.message : String(cause);
  const died = WORKER_DEATH.test(message) && !(cause instanceof Error && cause.name === 'KernelError');
  const where = `${tile.label} items ${tile.begin}..${tile.end}`;
  return died
    ? new PoolError('WORKER_DIED', `a worker died running kernel "${kernel}" on ${where}: ${message}`, { cause, kernel, tile })
    : new PoolError('KERNEL_FAILED', `kernel "${kernel}" failed on ${where}: ${message}`, { cause, kernel, tile });
}
