/**
 * `@lightkiln/bake/version`: the constants that identify what a bake makes, with no imports, so the CLI's
 * up-to-date check can read them without loading the bake.
 */
export const TOOL_NAME = 'lightkiln';
export const TOOL_VERSION = '0.1.0';
/** Algorithm versions: bump one when its stage's output changes, to invalidate old cache entries. */
export const STAGE_VERSIONS = Object.freeze({
    source: 1, pyramid: 9, level: 10, sh: 2, irradianceCube: 1, dfg: 2, specularFile: 4, irradianceFile: 3, lutFile: 2, view: 1, preview: 1,
});
/** The file that marks a folder as a lightkiln cache (only such folders are ever emptied). */
export const CACHE_MARKER_NAME = '.lightkiln-cache-folder';
//# sourceMappingURL=version.js.map