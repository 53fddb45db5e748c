/**
 * The cache store interface (has / get / put by key, with sizes) and two stores: a local folder (default)
 * and memory (tests). Stores move opaque bytes; entry.ts adds the checksum that detects corruption.
 */

import { randomBytes } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

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

const KEY = /^[0-9a-f]{64}$/;

function checkKey(key: string): void {
  if (!KEY.test(key)) throw new Error(`invalid cache key "${key}"`);
}

/** A folder of files named by key, written by temp file + rename; last use is the file's mtime. */
export class FolderStore implements CacheStore {
  readonly dir: string;

  constructor(dir: string) {
    this.dir = dir;
  }

  #path(key: string): string {
    checkKey(key);
    return join(this.dir, key.slice(0, 2), `${key}.entry`);
  }

  async has(key: string): Promise<boolean> {
    try {
      return statSync(this.#path(key)).isFile();
    } catch {
      return false;
    }
  }

  async get(key: string): Promise<Uint8Array | undefined> {
    const path = this.#path(key);
    let bytes: Uint8Array;
    try {
      bytes = readFileSync(path);
    } catch {
      return undefined;
    }
    try {
      const now = new Date();
      utimesSync(path, now, now);
    } catch {
      // A concurrent prune may have removed it; the bytes we read are still whole.
    }
    return new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  }

  async put(key: string, bytes: Uint8Array): Promise<void> {
    const path = this.#path(key);
    mkdirSync(join(this.dir, key.slice(0, 2)), { recursive: true });
    const tmp = `${path}.tmp-${process.pid}-${randomBytes(6).toString('hex')}`;
    try {
      writeFileSync(tmp, bytes);
      renameSync(tmp, path);
    } catch (error) {
      rmSync(tmp, { force: true });
      throw error;
    }
  }

  async delete(key: string): Promise<void> {
    rmSync(this.#path(key), { force: true });
  }

  async entries(): Promise<CacheEntryInfo[]> {
    const out: CacheEntryInfo[] = [];
    let shards: string[];
    try {
      shards = readdirSync(this.dir);
    } catch {
      return out;
    }
    for (const shard of shards) {
      if (!/^[0-9a-f]{2}$/.test(shard)) continue;
      for (const file of readdirSync(join(this.dir, shard))) {
        const m = /^([0-9a-f]{64})\.entry$/.exec(file);
        if (m === null) continue;
        try {
          const st = statSync(join(this.dir, shard, file));
          out.push({ key: m[1]!, size: st.size, lastUsed: st.mtimeMs });
        } catch {
          // removed meanwhile
        }
      }
    }
    return out;
  }
}

/** An in-memory store (tests, one-shot tools). */
export class MemoryStore implements CacheStore {
  readonly #map = new Map<string, { bytes: Uint8Array; lastUsed: number }>();
  #clock = 0;

  async has(key: string): Promise<boolean> {
    return this.#map.has(key);
  }

  async get(key: string): Promise<Uint8Array | undefined> {
    const e = this.#map.get(key);
    if (e === undefined) return undefined;
    e.lastUsed = ++this.#clock;
    return e.bytes;
  }

  async put(key: string, bytes: Uint8Array): Promise<void> {
    checkKey(key);
    this.#map.set(key, { bytes: bytes.slice(), lastUsed: ++this.#clock });
  }

  async delete(key: string): Promise<void> {
    this.#map.delete(key);
  }

  async entries(): Promise<CacheEntryInfo[]> {
    return [...this.#map].map(([key, e]) => ({ key, size: e.bytes.length, lastUsed: e.lastUsed }));
  }
}

/** Deletes least-recently-used entries until the total size is at most maxBytes; returns bytes freed. */
export async function pruneStore(store: CacheStore, maxBytes: number): Promise<{ removed: number; freedBytes: number; totalBytes: number }> {
  const entries = (await store.entries()).sort((a, b) => a.lastUsed - b.lastUsed);
  let total = entries.reduce((n, e) => n + e.size, 0);
  let removed = 0;
  let freed = 0;
  for (const e of entries) {
    if (total <= maxBytes) break;
    await store.delete(e.key);
    total -= e.size;
    freed += e.size;
    removed++;
  }
  return { removed, freedBytes: freed, totalBytes: total };
}
