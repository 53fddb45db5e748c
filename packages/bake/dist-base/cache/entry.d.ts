/**
 * Cache entry layout: "LKE2", UInt32 metadata length, metadata JSON, padding to 8, then typed arrays
 * (UInt32 kind, UInt32 byte length, bytes, padding to 8), then the SHA-256 of the entry's key (64 hex
 * characters, ASCII) followed by everything before the digest. Binding the key means an entry copied
 * over another one's file fails the check. A mismatching checksum marks the entry corrupt: it is deleted
 * and rebuilt.
 */
import type { CacheStore } from './store.js';
export type EntryArray = Float32Array | Float64Array | Uint8Array;
export interface CacheEntry {
    readonly meta: unknown;
    readonly arrays: readonly EntryArray[];
}
export declare function encodeEntry(entry: CacheEntry, key: string): Uint8Array;
/** Decodes the entry stored under `key`, or returns null when it is damaged in any way or belongs to another key. Arrays are fresh copies. */
export declare function decodeEntry(bytes: Uint8Array, key: string): CacheEntry | null;
export interface CacheStats {
    hits: number;
    misses: number;
    corrupt: number;
    writes: number;
}
/** Reads and writes checked entries through a store (or does nothing when the cache is off). */
export declare class EntryCache {
    readonly store: CacheStore | null;
    readonly stats: CacheStats;
    /** Called on every lookup with the key and whether it hit (events of the bake). */
    onAccess: ((key: string, hit: boolean) => void) | undefined;
    constructor(store: CacheStore | null);
    has(key: string): Promise<boolean>;
    get(key: string): Promise<CacheEntry | null>;
    put(key: string, entry: CacheEntry): Promise<void>;
}
//# sourceMappingURL=entry.d.ts.map