export { createBaker, Baker, STAGE_VERSIONS } from './bake.js';
export { defaultLevelCount, levelRoughness, resolveRecipe, roughnessToLod, roughnessToLodFormula, SAMPLE_PRESETS, SAFE_NAME } from './recipe.js';
export { LightkilnError, USER_ERROR_CODES, toLightkilnError } from './errors.js';
export { CACHE_MARKER, FolderStore, MemoryStore, notACache, pruneStore } from './cache/store.js';
export { refuseSymlink, writeFilesAtomic, removeLiveTempFiles, sweepStaleTempFiles, writeFileAtomic } from './files.js';
export { HttpStore, LayeredStore, RemoteUnavailableError, redactUrl } from './cache/remote.js';
export { decodeEntry, encodeEntry } from './cache/entry.js';
export { MANIFEST_SCHEMA_VERSION, TOOL_NAME, TOOL_VERSION } from './manifest.js';
export { cubeCross } from './stages/encode.js';
export { closeSharedPools, getSharedPool, WorkerPool } from '@lightkiln/pool';
export { inspectBytes } from './inspect.js';
export { previewFromManifest } from './preview/index.js';
export { renderContactSheet } from './preview/sheet.js';
export { sweepBudgets, sweepReport, SWEEP_METHODS } from './sweep.js';
//# sourceMappingURL=index.js.map