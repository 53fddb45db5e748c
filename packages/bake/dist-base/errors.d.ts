/** The error type of the public API: a string code, the file involved (if any) and the reason. */
export type LightkilnErrorCode = 'INVALID_RECIPE' | 'INVALID_OPTION' | 'INVALID_INPUT' | 'UNSUPPORTED_FORMAT' | 'LIMIT_EXCEEDED' | 'UNSAFE_PATH' | 'IO_ERROR' | 'ABORTED' | 'BAKE_FAILED';
/** Codes that mean "bad usage or bad input" (CLI exit code 2) rather than a failed bake (exit code 1). */
export declare const USER_ERROR_CODES: ReadonlySet<LightkilnErrorCode>;
export declare class LightkilnError extends Error {
    readonly code: LightkilnErrorCode;
    readonly file: string | undefined;
    constructor(code: LightkilnErrorCode, message: string, options?: {
        file?: string;
        cause?: unknown;
    });
    /** True for bad usage or bad input (exit code 2), false for a failure of the bake itself. */
    get isUserError(): boolean;
}
export declare function invalidRecipe(message: string): LightkilnError;
export declare function invalidOption(field: string, rule: string, value: unknown): LightkilnError;
export declare function unsafePath(name: string, reason: string): LightkilnError;
export declare function aborted(cause?: unknown): LightkilnError;
/** Maps codec, pool and system errors onto LightkilnError, keeping the original as `cause`. */
export declare function toLightkilnError(error: unknown, file?: string): LightkilnError;
//# sourceMappingURL=errors.d.ts.map