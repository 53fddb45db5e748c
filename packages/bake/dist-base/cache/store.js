/**
 * The cache store interface (has / get / put by key, with sizes) and two stores: a local folder (default)
 * and memory (tests). Stores move opaque bytes; entry.ts adds the checksum that detects corruption.
 */
import { CACHE_MARKER_NAME } from '../version.js';
import { existsSync, mkdirSync, readdirSync, readFileSync, rmdirSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { LightkilnError } from '../errors.js';
import { statOrNull, sweepStaleTempFiles, writeError, writeFileAtomic } from '../files.js';
/** The file that marks a folder as a lightkiln cache; destructive commands refuse a folder without it. */
export const CACHE_MARKER = CACHE_MARKER_NAME;
const MARKER_TEXT = 'This folder is a lightkiln cache: `lightkiln cache clear` may delete the entries in it.\n';
export function notACache(dir) {
    return new LightkilnError('INVALID_OPTION', `${dir} is not a lightkiln cache folder (no ${CACHE_MARKER} marker); refusing to delete anything in it`, { file: dir });
}
const KEY = /^[0-9a-f]{64}$/;
function checkKey(key) {
    if (!KEY.test(key))
        throw new Error(`invalid cache key "${key}"`);
}
/**
 * A folder of files named by key, written by temp file + rename; last use is the file's mtime. The first
 * write creates the folder's marker file (CACHE_MARKER); deletion needs it.
 */
export class FolderStore {
    dir;
    #claimed = false;
    #swept = new Set();
    constructor(dir) {
        this.dir = dir;
    }
    #path(key) {
        checkKey(key);
        return join(this.dir, key.slice(0, 2), `${key}.entry`);
    }
    async has(key) {
        try {
            return statSync(this.#path(key)).isFile();
        }
        catch {
            return false;
        }
    }
    async get(key) {
        const path = this.#path(key);
        let bytes;
        try {
            bytes = readFileSync(path);
        }
        catch {
            return undefined;
        }
        try {
            const now = new Date();
            utimesSync(path, now, now);
        }
        catch {
            // A concurrent prune may have removed it; the bytes we read are still whole.
        }
        return new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    }
    async put(key, bytes) {
        const path = this.#path(key);
        this.#claim();
        const shard = join(this.dir, key.slice(0, 2));
        try {
            mkdirSync(shard, { recursive: true });
        }
        catch (error) {
            throw writeError(shard, error);
        }
        if (!this.#swept.has(shard)) {
            this.#swept.add(shard);
            sweepStaleTempFiles(shard);
        }
        writeFileAtomic(path, bytes);
    }
    /** Makes the folder a cache (creates it and its marker file) before the first write. */
    #claim() {
        if (this.#claimed)
            return;
        try {
            mkdirSync(this.dir, { recursive: true });
            const marker = join(this.dir, CACHE_MARKER);
            if (!existsSync(marker))
                writeFileSync(marker, MARKER_TEXT);
        }
        catch (error) {
            throw writeError(this.dir, error);
        }
        this.#claimed = true;
    }
    /** True when the folder carries the marker of a lightkiln cache (or does not exist). */
    isCache() {
        return !existsSync(this.dir) || existsSync(join(this.dir, CACHE_MARKER));
    }
    /** Stale temp files of killed writers in the shards (removed unless dryRun). */
    sweepTemps(dryRun) {
        let files = 0;
        let bytes = 0;
        for (const shard of this.#shards()) {
            const r = sweepStaleTempFiles(join(this.dir, shard), dryRun);
            files += r.files;
            bytes += r.bytes;
        }
        return { files, bytes };
    }
    #shards() {
        try {
            return readdirSync(this.dir).filter((s) => /^[0-9a-f]{2}$/.test(s));
        }
        catch {
            return [];
        }
    }
    /**
     * Removes every entry, stale temp file, empty shard folder and the marker; the folder itself only
     * when nothing else is left in it. Refuses a folder without the marker: it is not ours.
     */
    clear() {
        if (!existsSync(this.dir))
            return { removed: 0, freedBytes: 0 };
        if (!this.isCache())
            throw notACache(this.dir);
        let removed = 0;
        let freedBytes = 0;
        for (const shard of this.#shards()) {
            const dir = join(this.dir, shard);
            for (const file of readdirSync(dir)) {
                if (!/^[0-9a-f]{64}\.entry$/.test(file))
                    continue;
                const st = statOrNull(join(dir, file));
                rmSync(join(dir, file), { force: true });
                removed++;
                freedBytes += Number(st?.size ?? 0);
            }
            sweepStaleTempFiles(dir);
            try {
                rmdirSync(dir);
            }
            catch {
                // not empty: something that is not ours stays
            }
        }
        // The CLI's up-to-date stamps (small JSON files, ours too).
        const stamps = join(this.dir, 'stamps');
        if (existsSync(stamps)) {
            for (const file of readdirSync(stamps))
                if (/^[0-9a-f]{64}\.stamp$/.test(file))
                    rmSync(join(stamps, file), { force: true });
            try {
                rmdirSync(stamps);
            }
            catch {
                // not empty
            }
        }
        rmSync(join(this.dir, CACHE_MARKER), { force: true });
        try {
            rmdirSync(this.dir);
        }
        catch {
            // not empty
        }
        this.#claimed = false;
        return { removed, freedBytes };
    }
    async delete(key) {
        rmSync(this.#path(key), { force: true });
    }
    async entries() {
        const out = [];
        let shards;
        try {
            shards = readdirSync(this.dir);
        }
        catch {
            return out;
        }
        for (const shard of shards) {
            if (!/^[0-9a-f]{2}$/.test(shard))
                continue;
            for (const file of readdirSync(join(this.dir, shard))) {
                const m = /^([0-9a-f]{64})\.entry$/.exec(file);
                if (m === null)
                    continue;
                try {
                    const st = statSync(join(this.dir, shard, file));
                    out.push({ key: m[1], size: st.size, lastUsed: st.mtimeMs });
                }
                catch {
                    // removed meanwhile
                }
            }
        }
        return out;
    }
}
/** An in-memory store (tests, one-shot tools). */
export class MemoryStore {
    #map = new Map();
    #clock = 0;
    async has(key) {
        return this.#map.has(key);
    }
    async get(key) {
        const e = this.#map.get(key);
        if (e === undefined)
            return undefined;
        e.lastUsed = ++this.#clock;
        return e.bytes;
    }
    async put(key, bytes) {
        checkKey(key);
        this.#map.set(key, { bytes: bytes.slice(), lastUsed: ++this.#clock });
    }
    async delete(key) {
        this.#map.delete(key);
    }
    async entries() {
        return [...this.#map].map(([key, e]) => ({ key, size: e.bytes.length, lastUsed: e.lastUsed }));
    }
}
/** Deletes least-recently-used entries until the total size is at most maxBytes; returns bytes freed. */
export async function pruneStore(store, maxBytes) {
    const entries = (await store.entries()).sort((a, b) => a.lastUsed - b.lastUsed);
    let total = entries.reduce((n, e) => n + e.size, 0);
    let removed = 0;
    let freed = 0;
    for (const e of entries) {
        if (total <= maxBytes)
            break;
        await store.delete(e.key);
        total -= e.size;
        freed += e.size;
        removed++;
    }
    return { removed, freedBytes: freed, totalBytes: total };
}
//# sourceMappingURL=store.js.map