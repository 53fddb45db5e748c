/** The error type of the public API: a string code, the file involved (if any) and the reason. */
/** Codes that mean "bad usage or bad input" (CLI exit code 2) rather than a failed bake (exit code 1). */
export const USER_ERROR_CODES = new Set([
    'INVALID_RECIPE', 'INVALID_OPTION', 'INVALID_INPUT', 'UNSUPPORTED_FORMAT', 'LIMIT_EXCEEDED', 'UNSAFE_PATH',
]);
export class LightkilnError extends Error {
    code;
    file;
    constructor(code, message, options = {}) {
        super(message, options.cause === undefined ? undefined : { cause: options.cause });
        this.name = 'LightkilnError';
        this.code = code;
        this.file = options.file;
    }
    /** True for bad usage or bad input (exit code 2), false for a failure of the bake itself. */
    get isUserError() {
        return USER_ERROR_CODES.has(this.code);
    }
}
export function invalidRecipe(message) {
    return new LightkilnError('INVALID_RECIPE', `invalid recipe: ${message}`);
}
export function invalidOption(field, rule, value) {
    return new LightkilnError('INVALID_OPTION', `option "${field}" ${rule} (got ${JSON.stringify(value)})`);
}
export function unsafePath(name, reason) {
    return new LightkilnError('UNSAFE_PATH', `refusing output name "${name}": ${reason}`);
}
export function aborted(cause) {
    return new LightkilnError('ABORTED', 'the bake was aborted', { cause });
}
/** Maps codec, pool and system errors onto LightkilnError, keeping the original as `cause`. */
export function toLightkilnError(error, file) {
    if (error instanceof LightkilnError)
        return error;
    const e = (typeof error === 'object' && error !== null ? error : {});
    const message = typeof e.message === 'string' ? e.message : String(error);
    const code = typeof e.code === 'string' ? e.code : '';
    const opts = { cause: error, ...(typeof e.file === 'string' ? { file: e.file } : file === undefined ? {} : { file }) };
    if (e.name === 'CodecError') {
        if (code === 'LIMIT_EXCEEDED')
            return new LightkilnError('LIMIT_EXCEEDED', message, opts);
        if (code === 'UNSUPPORTED_FORMAT' || code === 'UNSUPPORTED_FEATURE')
            return new LightkilnError('UNSUPPORTED_FORMAT', message, opts);
        return new LightkilnError('INVALID_INPUT', message, opts);
    }
    if (e.name === 'PoolError' && code === 'ABORTED')
        return aborted(error);
    if (code === 'ENOENT' || code === 'EACCES' || code === 'EISDIR' || code === 'ENOTDIR') {
        return new LightkilnError('INVALID_INPUT', file === undefined ? message : `${file}: cannot read (${code})`, opts);
    }
    if (e.name === 'AbortError')
        return aborted(error);
    return new LightkilnError('BAKE_FAILED', message, opts);
}
//# sourceMappingURL=errors.js.map