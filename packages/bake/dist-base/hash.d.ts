/** Content hashing for cache keys and manifests. */
export declare function sha256Hex(bytes: Uint8Array): string;
/**
 * sha256Hex of a large input in 4 MiB steps with a turn of the event loop between them (about 10 ms
 * each), so the pool's workers get their next tiles while this thread hashes a big image.
 */
export declare function sha256HexYielding(bytes: Uint8Array): Promise<string>;
/** JSON with object keys sorted, so equal values always hash equally. */
export declare function stableJson(value: unknown): string;
/** A cache key: sha256 of the stage name, its algorithm version and everything it depends on. */
export declare function stageKey(stage: string, version: number, parts: unknown): string;
//# sourceMappingURL=hash.d.ts.map