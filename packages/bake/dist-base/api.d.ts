/** The public types of the async API (Baker in bake.ts). */
import type { WorkerPool } from '@lightkiln/pool';
import type { CacheStats } from './cache/entry.js';
import type { CacheStore } from './cache/store.js';
import type { BakeEvent } from './events.js';
import type { Manifest } from './manifest.js';
import type { BakeProgress } from './stages/context.js';
import type { ArtifactKind, PlanItem } from './tables.js';
export type { ArtifactKind, PlanItem } from './tables.js';
export interface BakerOptions {
    /** Worker threads; default the machine's available parallelism; 0 runs inline. Range 0..256. */
    readonly threads?: number;
    /** An explicit pool (overrides threads); the baker does not close it. */
    readonly pool?: WorkerPool;
    /**
     * Cache: a folder path, a CacheStore, or false for none. Default: the folder ".lightkiln-cache" in
     * the current directory.
     */
    readonly cache?: string | CacheStore | false;
    /**
     * A shared cache server (HTTP build-cache protocol, cache/remote.ts) behind the local cache folder:
     * read-through, write-through, degrading to local with one warning when it fails. Credentials in the
     * URL or LIGHTKILN_REMOTE_CACHE_TOKEN.
     */
    readonly remoteCache?: string;
    /** Milliseconds per remote request before the remote counts as down. Default 10 000. */
    readonly remoteTimeoutMs?: number;
    /** Receives warnings (a remote cache switched off). Default: process.emitWarning. */
    readonly onWarning?: (message: string) => void;
    /** Least-recently-used eviction after each bake down to this many bytes; default unlimited. */
    readonly cacheMaxBytes?: number;
    /** Cost units (texels x samples) per pool tile; default 200 000. */
    readonly targetTileCost?: number;
}
export interface BakeRunOptions {
    /** Write the artifacts here (created if missing); without it the bake only returns them. */
    readonly outDir?: string;
    readonly signal?: AbortSignal;
    readonly onProgress?: (progress: BakeProgress) => void;
    /** Structured events: stages started and finished, progress, cache hits and misses, artifacts (events.ts). */
    readonly onEvent?: (event: BakeEvent) => void;
}
export interface BakedArtifact {
    readonly kind: ArtifactKind;
    /** File name inside the output folder. */
    readonly name: string;
    /** Full path when written (outDir given), else null. */
    readonly path: string | null;
    readonly format: string;
    readonly bytes: Uint8Array;
    readonly sha256: string;
    readonly fromCache: boolean;
}
export interface BakeResult {
    readonly artifacts: readonly BakedArtifact[];
    readonly manifest: Manifest;
    readonly cache: CacheStats;
}
export interface LutOptions {
    /** Table size (square), 8..1024. Default 128. */
    readonly size?: number;
    /** Samples per texel, 16..65536. Default 1024. */
    readonly samples?: number;
    readonly multiscatter?: boolean;
    readonly cloth?: boolean;
    readonly supercompression?: 'none' | 'zlib' | 'zstd';
}
export interface BakePlan {
    readonly probe: string;
    readonly upToDate: boolean;
    readonly artifacts: readonly (PlanItem & {
        readonly name: string;
    })[];
    readonly stages: readonly PlanItem[];
}
//# sourceMappingURL=api.d.ts.map