/** Content hashing for cache keys and manifests. */
import { createHash } from 'node:crypto';
export function sha256Hex(bytes) {
    return createHash('sha256').update(bytes).digest('hex');
}
const HASH_CHUNK = 4 << 20;
/**
 * sha256Hex of a large input in 4 MiB steps with a turn of the event loop between them (about 10 ms
 * each), so the pool's workers get their next tiles while this thread hashes a big image.
 */
export async function sha256HexYielding(bytes) {
    const hash = createHash('sha256');
    for (let o = 0; o < bytes.length; o += HASH_CHUNK) {
        if (o > 0)
            await new Promise((resolve) => setImmediate(resolve));
        hash.update(bytes.subarray(o, Math.min(bytes.length, o + HASH_CHUNK)));
    }
    return hash.digest('hex');
}
/** JSON with object keys sorted, so equal values always hash equally. */
export function stableJson(value) {
    if (value === null || typeof value !== 'object')
        return JSON.stringify(value) ?? 'null';
    if (Array.isArray(value))
        return `[${value.map(stableJson).join(',')}]`;
    const entries = Object.entries(value).filter(([, v]) => v !== undefined).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableJson(v)}`).join(',')}}`;
}
/** A cache key: sha256 of the stage name, its algorithm version and everything it depends on. */
export function stageKey(stage, version, parts) {
    return createHash('sha256').update(stableJson({ stage, version, parts })).digest('hex');
}
//# sourceMappingURL=hash.js.map