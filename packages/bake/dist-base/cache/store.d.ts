/**
 * The cache store interface (has / get / put by key, with sizes) and two stores: a local folder (default)
 * and memory (tests). Stores move opaque bytes; entry.ts adds the checksum that detects corruption.
 */
import { LightkilnError } from '../errors.js';
/** The file that marks a folder as a lightkiln cache; destructive commands refuse a folder without it. */
export declare const CACHE_MARKER: string;
export declare function notACache(dir: string): LightkilnError;
export interface CacheEntryInfo {
    readonly key: string;
    readonly size: number;
    /** Milliseconds since the epoch of the last get or put (least-recently-used order). */
    readonly lastUsed: number;
}
export interface CacheStore {
    has(key: string): Promise<boolean>;
    get(key: string): Promise<Uint8Array | undefined>;
    /** Stores atomically: readers see the old entry, nothing, or the whole new entry. */
    put(key: string, bytes: Uint8Array): Promise<void>;
    delete(key: string): Promise<void>;
    entries(): Promise<CacheEntryInfo[]>;
}
/**
 * A folder of files named by key, written by temp file + rename; last use is the file's mtime. The first
 * write creates the folder's marker file (CACHE_MARKER); deletion needs it.
 */
export declare class FolderStore implements CacheStore {
    #private;
    readonly dir: string;
    constructor(dir: string);
    has(key: string): Promise<boolean>;
    get(key: string): Promise<Uint8Array | undefined>;
    put(key: string, bytes: Uint8Array): Promise<void>;
    /** True when the folder carries the marker of a lightkiln cache (or does not exist). */
    isCache(): boolean;
    /** Stale temp files of killed writers in the shards (removed unless dryRun). */
    sweepTemps(dryRun: boolean): {
        files: number;
        bytes: number;
    };
    /**
     * Removes every entry, stale temp file, empty shard folder and the marker; the folder itself only
     * when nothing else is left in it. Refuses a folder without the marker: it is not ours.
     */
    clear(): {
        removed: number;
        freedBytes: number;
    };
    delete(key: string): Promise<void>;
    entries(): Promise<CacheEntryInfo[]>;
}
/** An in-memory store (tests, one-shot tools). */
export declare class MemoryStore implements CacheStore {
    #private;
    has(key: string): Promise<boolean>;
    get(key: string): Promise<Uint8Array | undefined>;
    put(key: string, bytes: Uint8Array): Promise<void>;
    delete(key: string): Promise<void>;
    entries(): Promise<CacheEntryInfo[]>;
}
/** Deletes least-recently-used entries until the total size is at most maxBytes; returns bytes freed. */
export declare function pruneStore(store: CacheStore, maxBytes: number): Promise<{
    removed: number;
    freedBytes: number;
    totalBytes: number;
}>;
//# sourceMappingURL=store.d.ts.map