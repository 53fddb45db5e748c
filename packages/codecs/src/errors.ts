/** Typed codec errors: every failure names the file and the reason, with a stable string code. */

export type CodecErrorCode =
  | 'BAD_MAGIC'
  | 'TRUNCATED'
  | 'CORRUPT'
  | 'BAD_DIMENSIONS'
  | 'LIMIT_EXCEEDED'
  | 'UNSUPPORTED_FEATURE'
  | 'UNSUPPORTED_FORMAT'
  | 'INVALID_ARGUMENT';

export class CodecError extends Error {
  readonly code: CodecErrorCode;
  /** The file (or label) the bytes came from. */
  readonly file: string;
  /** The reason alone, without the file name. */
  readonly reason: string;

  constructor(code: CodecErrorCode, file: string, reason: string, cause?: unknown) {
    super(`${file}: ${reason}`, cause === undefined ? undefined : { cause });
    this.name = 'CodecError';
    this.code = code;
    this.file = file;
    this.reason = reason;
  }
}

export function badMagic(file: string, what: string): CodecError {
  return new CodecError('BAD_MAGIC', file, `not ${what} (wrong signature)`);
}

export function truncated(file: string, what: string): CodecError {
  return new CodecError('TRUNCATED', file, `file is truncated (${what})`);
}

export function corrupt(file: string, reason: string, cause?: unknown): CodecError {
  return new CodecError('CORRUPT', file, reason, cause);
}

export function unsupported(file: string, feature: string): CodecError {
  return new CodecError('UNSUPPORTED_FEATURE', file, `unsupported feature: ${feature}`);
}

export function invalidArgument(file: string, reason: string): CodecError {
  return new CodecError('INVALID_ARGUMENT', file, reason);
}
