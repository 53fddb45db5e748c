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
import { createHash } from 'node:crypto';
/** The URL without credentials, query or fragment (for messages). */
export function redactUrl(url) {
    try {
        const u = new URL(url);
        return `${u.protocol}//${u.host}${u.pathname}`;
    }
    catch {
        return '<invalid url>';
    }
}
const sha256 = (bytes) => createHash('sha256').update(bytes).digest('hex');
/** The server could not be reached, timed out, refused the credentials or failed (5xx). */
export class RemoteUnavailableError extends Error {
}
/** The HTTP build-cache client (throws RemoteUnavailableError on transport failures and server errors). */
export class HttpStore {
    #base;
    #headers;
    #timeoutMs;
    label;
    constructor(url, options = {}) {
        const u = new URL(url);
        if (u.protocol !== 'http:' && u.protocol !== 'https:')
            throw new Error(`remote cache URL must be http or https, got ${redactUrl(url)}`);
        const headers = {};
        const token = options.token ?? process.env.LIGHTKILN_REMOTE_CACHE_TOKEN;
        if (u.username !== '' || u.password !== '') {
            headers.authorization = `Basic ${Buffer.from(`${decodeURIComponent(u.username)}:${decodeURIComponent(u.password)}`).toString('base64')}`;
        }
        else if (token !== undefined && token !== '') {
            headers.authorization = `Bearer ${token}`;
        }
        u.username = '';
        u.password = '';
        this.#base = u.href.replace(/\/+$/, '');
        this.#headers = headers;
        this.#timeoutMs = options.timeoutMs ?? 10_000;
        this.label = redactUrl(url);
    }
    async #request(method, path, body) {
        let response;
        try {
            response = await fetch(`${this.#base}/${path}`, {
                method,
                headers: { ...this.#headers, ...(body !== undefined ? { 'content-type': 'application/octet-stream' } : {}) },
                ...(body !== undefined ? { body } : {}),
                signal: AbortSignal.timeout(this.#timeoutMs),
            });
        }
        catch (error) {
            throw new RemoteUnavailableError(`${method} ${this.label}/${path.split('/')[0]}: ${error instanceof Error ? error.message : String(error)}`);
        }
        if (response.status >= 500 || response.status === 401 || response.status === 403) {
            await response.arrayBuffer().catch(() => undefined);
            throw new RemoteUnavailableError(`${method} ${this.label}/${path.split('/')[0]}: HTTP ${response.status}`);
        }
        return response;
    }
    async has(key) {
        const r = await this.#request('HEAD', `ac/${key}`);
        return r.ok;
    }
    /** The record's content, verified by digest; undefined for a miss, a bad record or a corrupt blob. */
    async get(key) {
        const r = await this.#request('GET', `ac/${key}`);
        if (!r.ok) {
            await r.arrayBuffer().catch(() => undefined);
            return undefined;
        }
        let digest;
        try {
            digest = JSON.parse(await r.text()).digests;
        }
        catch {
            return undefined;
        }
        if (!Array.isArray(digest) || digest.length !== 1 || typeof digest[0] !== 'string' || !/^[0-9a-f]{64}$/.test(digest[0]))
            return undefined;
        const blob = await this.#request('GET', `cas/${digest[0]}`);
        if (!blob.ok) {
            await blob.arrayBuffer().catch(() => undefined);
            return undefined;
        }
        const bytes = new Uint8Array(await blob.arrayBuffer());
        return sha256(bytes) === digest[0] ? bytes : undefined;
    }
    /** Uploads the content, then the record that points to it. */
    async put(key, bytes) {
        const digest = sha256(bytes);
        const blob = await this.#request('PUT', `cas/${digest}`, bytes);
        if (!blob.ok)
            throw new RemoteUnavailableError(`PUT ${this.label}/cas: HTTP ${blob.status}`);
        const record = new TextEncoder().encode(JSON.stringify({ digests: [digest], size: bytes.length }));
        const ac = await this.#request('PUT', `ac/${key}`, record);
        if (!ac.ok)
            throw new RemoteUnavailableError(`PUT ${this.label}/ac: HTTP ${ac.status}`);
    }
    async delete(key) {
        await this.#request('DELETE', `ac/${key}`);
    }
    /** Stores content under its SHA-256 (cas/) and returns the digest; skips the upload when present. */
    async putBlob(bytes) {
        const digest = sha256(bytes);
        const head = await this.#request('HEAD', `cas/${digest}`);
        if (head.ok && Number(head.headers.get('content-length')) === bytes.length)
            return digest;
        const r = await this.#request('PUT', `cas/${digest}`, bytes);
        if (!r.ok)
            throw new RemoteUnavailableError(`PUT ${this.label}/cas: HTTP ${r.status}`);
        return digest;
    }
    /** Content by digest, verified; undefined when absent or corrupt. */
    async getBlob(digest) {
        if (!/^[0-9a-f]{64}$/.test(digest))
            return undefined;
        const r = await this.#request('GET', `cas/${digest}`);
        if (!r.ok) {
            await r.arrayBuffer().catch(() => undefined);
            return undefined;
        }
        const bytes = new Uint8Array(await r.arrayBuffer());
        return sha256(bytes) === digest ? bytes : undefined;
    }
    /** A remote cache is not listed (the server owns its eviction). */
    async entries() {
        return [];
    }
}
/** Local folder first, remote behind it; a failing remote degrades to local with one warning. */
export class LayeredStore {
    local;
    remote;
    #warn;
    #remoteUp = true;
    /** Entries served from the remote, and entries uploaded. */
    remoteStats = { hits: 0, misses: 0, uploads: 0, disabled: false };
    constructor(local, remote, options = {}) {
        this.local = local;
        this.remote = remote;
        this.#warn = options.onWarning ?? ((m) => process.emitWarning(m, { code: 'LIGHTKILN_REMOTE_CACHE' }));
    }
    async #remote(fn, fallback) {
        if (!this.#remoteUp)
            return fallback;
        try {
            return await fn();
        }
        catch (error) {
            if (!(error instanceof RemoteUnavailableError))
                throw error;
            // Requests in flight side by side can fail together: one warning all the same.
            if (!this.#remoteUp)
                return fallback;
            this.#remoteUp = false;
            this.remoteStats.disabled = true;
            this.#warn(`remote cache ${this.remote.label} is unavailable (${error.message}); baking with the local cache only`);
            return fallback;
        }
    }
    async has(key) {
        return (await this.local.has(key)) || this.#remote(() => this.remote.has(key), false);
    }
    async get(key) {
        const local = await this.local.get(key);
        if (local !== undefined)
            return local;
        const remote = await this.#remote(() => this.remote.get(key), undefined);
        if (remote === undefined) {
            if (this.#remoteUp)
                this.remoteStats.misses++;
            return undefined;
        }
        this.remoteStats.hits++;
        await this.local.put(key, remote);
        return remote;
    }
    async put(key, bytes) {
        await this.local.put(key, bytes);
        const ok = await this.#remote(async () => {
            await this.remote.put(key, bytes);
            return true;
        }, false);
        if (ok)
            this.remoteStats.uploads++;
    }
    /** Deletes the local copy and the remote record (a corrupt entry is then rebuilt and replaced). */
    async delete(key) {
        await this.local.delete(key);
        await this.#remote(() => this.remote.delete(key), undefined);
    }
    async entries() {
        return this.local.entries();
    }
}
//# sourceMappingURL=remote.js.map