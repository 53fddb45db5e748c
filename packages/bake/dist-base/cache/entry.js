/**
 * Cache entry layout: "LKE2", UInt32 metadata length, metadata JSON, padding to 8, then typed arrays
 * (UInt32 kind, UInt32 byte length, bytes, padding to 8), then the SHA-256 of the entry's key (64 hex
 * characters, ASCII) followed by everything before the digest. Binding the key means an entry copied
 * over another one's file fails the check. A mismatching checksum marks the entry corrupt: it is deleted
 * and rebuilt.
 */
import { createHash } from 'node:crypto';
const MAGIC = 0x32454b4c; // "LKE2" little-endian
const KIND = { f32: 1, f64: 2, u8: 3 };
const pad8 = (n) => (n + 7) & ~7;
export function encodeEntry(entry, key) {
    const meta = new TextEncoder().encode(JSON.stringify(entry.meta));
    let size = pad8(8 + meta.length);
    for (const a of entry.arrays)
        size += 8 + pad8(a.byteLength);
    const out = new Uint8Array(size + 32);
    const view = new DataView(out.buffer);
    view.setUint32(0, MAGIC, true);
    view.setUint32(4, meta.length, true);
    out.set(meta, 8);
    let pos = pad8(8 + meta.length);
    for (const a of entry.arrays) {
        view.setUint32(pos, a instanceof Float32Array ? KIND.f32 : a instanceof Float64Array ? KIND.f64 : KIND.u8, true);
        view.setUint32(pos + 4, a.byteLength, true);
        out.set(new Uint8Array(a.buffer, a.byteOffset, a.byteLength), pos + 8);
        pos += 8 + pad8(a.byteLength);
    }
    out.set(createHash('sha256').update(key, 'latin1').update(out.subarray(0, size)).digest(), size);
    return out;
}
/** Decodes the entry stored under `key`, or returns null when it is damaged in any way or belongs to another key. Arrays are fresh copies. */
export function decodeEntry(bytes, key) {
    if (bytes.length < 48)
        return null;
    const size = bytes.length - 32;
    const digest = createHash('sha256').update(key, 'latin1').update(bytes.subarray(0, size)).digest();
    for (let i = 0; i < 32; i++)
        if (digest[i] !== bytes[size + i])
            return null;
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    if (view.getUint32(0, true) !== MAGIC)
        return null;
    const metaLength = view.getUint32(4, true);
    if (8 + metaLength > size)
        return null;
    let meta;
    try {
        meta = JSON.parse(new TextDecoder().decode(bytes.subarray(8, 8 + metaLength)));
    }
    catch {
        return null;
    }
    const arrays = [];
    let pos = pad8(8 + metaLength);
    while (pos < size) {
        const kind = view.getUint32(pos, true);
        const length = view.getUint32(pos + 4, true);
        if (pos + 8 + length > size)
            return null;
        const copy = bytes.slice(pos + 8, pos + 8 + length);
        if (kind === KIND.f32)
            arrays.push(new Float32Array(copy.buffer, 0, length / 4));
        else if (kind === KIND.f64)
            arrays.push(new Float64Array(copy.buffer, 0, length / 8));
        else if (kind === KIND.u8)
            arrays.push(copy);
        else
            return null;
        pos += 8 + pad8(length);
    }
    return { meta, arrays };
}
/** Reads and writes checked entries through a store (or does nothing when the cache is off). */
export class EntryCache {
    store;
    stats = { hits: 0, misses: 0, corrupt: 0, writes: 0 };
    /** Called on every lookup with the key and whether it hit (events of the bake). */
    onAccess;
    constructor(store) {
        this.store = store;
    }
    async has(key) {
        return this.store !== null && (await this.store.has(key));
    }
    async get(key) {
        if (this.store === null) {
            this.onAccess?.(key, false);
            return null;
        }
        const bytes = await this.store.get(key);
        if (bytes === undefined) {
            this.stats.misses++;
            this.onAccess?.(key, false);
            return null;
        }
        const entry = decodeEntry(bytes, key);
        if (entry === null) {
            this.stats.corrupt++;
            this.stats.misses++;
            await this.store.delete(key);
            this.onAccess?.(key, false);
            return null;
        }
        this.stats.hits++;
        this.onAccess?.(key, true);
        return entry;
    }
    async put(key, entry) {
        if (this.store === null)
            return;
        await this.store.put(key, encodeEntry(entry, key));
        this.stats.writes++;
    }
}
//# sourceMappingURL=entry.js.map