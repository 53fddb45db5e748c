/**
 * `@lightkiln/bake/version`: the constants that identify what a bake makes, with no imports, so the CLI's
 * up-to-date check can read them without loading the bake.
 */
export declare const TOOL_NAME = "lightkiln";
export declare const TOOL_VERSION = "0.1.0";
/** Algorithm versions: bump one when its stage's output changes, to invalidate old cache entries. */
export declare const STAGE_VERSIONS: Readonly<Record<string, number>>;
/** The file that marks a folder as a lightkiln cache (only such folders are ever emptied). */
export declare const CACHE_MARKER_NAME = ".lightkiln-cache-folder";
//# sourceMappingURL=version.d.ts.map