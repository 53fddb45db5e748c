/**
 * The shared cache (HTTP build-cache protocol: cas/<sha256>, ac/<key>) against a real server: Debian
 * nginx's WebDAV module on a loopback port (test/helpers/nginx.ts).
 */

import { createHash } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeSharedPools, createBaker, type Recipe } from '@lightkiln/bake';
import { hasTool } from '../../../test/helpers/tools.js';
import { disposeDavServer, startDavServer, type DavServer } from '../../../test/helpers/nginx.js';
import { equirectOf } from './helpers.js';

const work = mkdtempSync(join(tmpdir(), 'lightkiln-remote-'));
let server: DavServer | null = null;
const enabled = hasTool('nginx');

beforeAll(async () => {
  if (enabled) server = await startDavServer();
});
afterAll(async () => {
  if (server !== null) await disposeDavServer(server);
  rmSync(work, { recursive: true, force: true });
  await closeSharedPools();
});

const recipe: Recipe = { input: { bytes: equirectOf((x, y) => [1 + 0.5 * y, 0.8 + 0.3 * x, 0.6], 64, 32), name: 'sky.pfm' }, size: 16, samples: 'draft' };
let n = 0;
const freshDir = (): string => join(work, `local-${n++}`);
const files = (dir: string): string[] => readdirSync(dir);

describe.runIf(enabled)('shared cache on nginx WebDAV', () => {
  it('uploads content before records, and a machine with an empty local cache bakes nothing', async () => {
    const warnings: string[] = [];
    const a = createBaker({ threads: 2, cache: freshDir(), remoteCache: server!.url, onWarning: (m) => warnings.push(m) });
    const first = await a.bake(recipe);
    await a.close();
    expect(warnings).toEqual([]);
    const cas = files(join(server!.data, 'cas'));
    const ac = files(join(server!.data, 'ac'));
    expect(cas.length).toBeGreaterThan(5);
    expect(ac.length).toBe(cas.length);
    // Every blob is stored under its own SHA-256.
    for (const d of cas) expect(createHash('sha256').update(readFileSync(join(server!.data, 'cas', d))).digest('hex')).toBe(d);
    const b = createBaker({ threads: 2, cache: freshDir(), remoteCache: server!.url });
    const second = await b.bake(recipe);
    await b.close();
    expect(second.artifacts.filter((x) => x.kind !== 'manifest').every((x) => x.fromCache)).toBe(true);
    expect(second.cache.writes).toBe(0);
    expect(second.artifacts.map((x) => x.sha256).slice(0, 3)).toEqual(first.artifacts.map((x) => x.sha256).slice(0, 3));
  }, 60_000);

  it('never serves a corrupted blob: detected by digest, rebaked, replaced', async () => {
    const casDir = join(server!.data, 'cas');
    for (const d of files(casDir)) writeFileSync(join(casDir, d), readFileSync(join(casDir, d)).subarray(0, 10));
    const c = createBaker({ threads: 2, cache: freshDir(), remoteCache: server!.url });
    const result = await c.bake(recipe);
    await c.close();
    expect(result.cache.writes).toBeGreaterThan(0);
    for (const d of files(casDir)) expect(createHash('sha256').update(readFileSync(join(casDir, d))).digest('hex')).toBe(d);
  }, 60_000);

  it('a stopped server degrades to a local bake with one warning that shows no credentials', async () => {
    await server!.stop();
    try {
      const warnings: string[] = [];
      const url = server!.url.replace('http://', 'http://builder:s3cret@');
      const d = createBaker({ threads: 2, cache: freshDir(), remoteCache: url, remoteTimeoutMs: 2000, onWarning: (m) => warnings.push(m) });
      const result = await d.bake(recipe);
      await d.close();
      expect(result.artifacts.length).toBeGreaterThan(3);
      expect(warnings).toHaveLength(1);
      expect(warnings[0]).toContain('unavailable');
      expect(warnings[0]).not.toContain('s3cret');
      expect(warnings[0]).not.toContain('builder');
    } finally {
      await server!.start();
    }
  }, 60_000);
});
