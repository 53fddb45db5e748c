/**
 * A shared cache on any server that speaks the common HTTP build-cache protocol: GET / PUT / HEAD on
 * `<url>/cas/<sha256>` (content, addressed by its SHA-256, FIPS 180-4) and `<url>/ac/<key>` (a small JSON
 * record from a cache key to the content digests it needs). Content is uploaded before the record that
 * points to it, and verified against its digest on every read: a mismatch is a miss, never served. Works
 * against nginx's WebDAV module (PUT creating folders) and similar servers.
 *
 * LayeredStore puts it behind the local folder: reads go local first, then remote (a remote hit is copied
 * into the local folder); writes go to both. A remote that fails or times out is switched off for the
 * rest of the process after one warning, and the bake goes on locally: never a failure. Credentials come
 * from the URL (user:password@) or LIGHTKILN_REMOTE_CACHE_TOKEN (a bearer token) and are never printed:
 * messages name the server by its redacted URL.
 */
import type { CacheEntryInfo, CacheStore } from './store.js';
export interface RemoteStoreOptions {
    /** Milliseconds per request before the remote counts as down. Default 10 000. */
    readonly timeoutMs?: number;
    /** Receives the one warning when the remote is switched off. Default: process.emitWarning. */
    readonly onWarning?: (message: string) => void;
    /** Bearer token; default the LIGHTKILN_REMOTE_CACHE_TOKEN environment variable. */
    readonly token?: string;
}
/** The URL without credentials, query or fragment (for messages). */
export declare function redactUrl(url: string): string;
/** The server could not be reached, timed out, refused the credentials or failed (5xx). */
export declare class RemoteUnavailableError extends Error {
}
/** The HTTP build-cache client (throws RemoteUnavailableError on transport failures and server errors). */
export declare class HttpStore implements CacheStore {
    #private;
    readonly label: string;
    constructor(url: string, options?: RemoteStoreOptions);
    has(key: string): Promise<boolean>;
    /** The record's content, verified by digest; undefined for a miss, a bad record or a corrupt blob. */
    get(key: string): Promise<Uint8Array | undefined>;
    /** Uploads the content, then the record that points to it. */
    put(key: string, bytes: Uint8Array): Promise<void>;
    delete(key: string): Promise<void>;
    /** Stores content under its SHA-256 (cas/) and returns the digest; skips the upload when present. */
    putBlob(bytes: Uint8Array): Promise<string>;
    /** Content by digest, verified; undefined when absent or corrupt. */
    getBlob(digest: string): Promise<Uint8Array | undefined>;
    /** A remote cache is not listed (the server owns its eviction). */
    entries(): Promise<CacheEntryInfo[]>;
}
/** Local folder first, remote behind it; a failing remote degrades to local with one warning. */
export declare class LayeredStore implements CacheStore {
    #private;
    readonly local: CacheStore;
    readonly remote: HttpStore;
    /** Entries served from the remote, and entries uploaded. */
    readonly remoteStats: {
        hits: number;
        misses: number;
        uploads: number;
        disabled: boolean;
    };
    constructor(local: CacheStore, remote: HttpStore, options?: RemoteStoreOptions);
    has(key: string): Promise<boolean>;
    get(key: string): Promise<Uint8Array | undefined>;
    put(key: string, bytes: Uint8Array): Promise<void>;
    /** Deletes the local copy and the remote record (a corrupt entry is then rebuilt and replaced). */
    delete(key: string): Promise<void>;
    entries(): Promise<CacheEntryInfo[]>;
}
//# sourceMappingURL=remote.d.ts.map