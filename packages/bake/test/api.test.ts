import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync, symlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { read as readKtx2 } from 'ktx-parse';
import { decodeKtx2, encodeHdr, encodePfm } from '@lightkiln/codecs';
import { closeSharedPools, createBaker, decodeEntry, FolderStore, LightkilnError, MemoryStore, type Recipe } from '@lightkiln/bake';
import { equirectOf } from './helpers.js';

const dirs: string[] = [];
function tempDir(): string {
  const d = mkdtempSync(join(tmpdir(), 'lightkiln-bake-'));
  dirs.push(d);
  return d;
}
afterAll(async () => {
  for (const d of dirs) rmSync(d, { recursive: true, force: true });
  await closeSharedPools();
});

const skyBytes = equirectOf((x, y, z) => {
  const s = Math.exp((0.6 * x + 0.3 * y - 0.74 * z - 1) * 60) * 50;
  return [1 + 0.4 * y + s, 0.9 + 0.2 * x + s, 0.7 + 0.1 * z + s];
}, 128, 64);
// Five levels (the full chain of a 16 cube), so per-level behaviour has levels to work with.
const recipe = (extra: Partial<Recipe> = {}): Recipe => ({ input: { bytes: skyBytes, name: 'sky.pfm' }, name: 'sky', size: 16, levels: 5, samples: 'draft', dfg: { size: 16, samples: 64 }, ...extra });
const hashes = (r: { artifacts: readonly { kind: string; sha256: string }[] }): string[] => r.artifacts.filter((a) => a.kind !== 'manifest').map((a) => a.sha256);

describe('determinism', () => {
  it('gives byte-identical artifacts over threads 0, 1, 2, tile sizes and cache hit vs miss', async () => {
    const seen = new Set<string>();
    for (const threads of [0, 1, 2]) {
      for (const targetTileCost of [500, 100_000]) {
        const baker = createBaker({ threads, cache: false, targetTileCost });
        seen.add(hashes(await baker.bake(recipe())).join());
        await baker.close();
      }
    }
    const store = new MemoryStore();
    const cached = createBaker({ threads: 2, cache: store });
    const miss = await cached.bake(recipe());
    const hit = await cached.bake(recipe());
    seen.add(hashes(miss).join());
    seen.add(hashes(hit).join());
    expect(hit.artifacts.filter((a) => a.kind !== 'manifest').every((a) => a.fromCache)).toBe(true);
    expect(seen.size).toBe(1);
  });
});

describe('content-hash cache', () => {
  it('reads an unchanged recipe entirely from the cache', async () => {
    const baker = createBaker({ threads: 2, cache: new MemoryStore() });
    const cold = await baker.bake(recipe());
    expect(cold.cache.writes).toBeGreaterThan(5);
    const plan = await baker.plan(recipe());
    expect(plan.upToDate).toBe(true);
    expect(plan.stages.every((s) => !s.willCompute)).toBe(true);
    const warm = await baker.bake(recipe());
    expect(warm.cache.writes).toBe(0);
    expect(warm.cache.hits).toBe(3); // the three files; no intermediate is even read
  });

  it('reruns only what an option change touches', async () => {
    const baker = createBaker({ threads: 2, cache: new MemoryStore() });
    await baker.bake(recipe());
    // Irradiance options: no specular level, pyramid or DFG work.
    const irrPlan = await baker.plan(recipe({ irradiance: { cubeSize: 8 } }));
    const computes = (p: typeof irrPlan): string[] => p.stages.filter((s) => s.willCompute).map((s) => s.kind);
    expect(computes(irrPlan)).toEqual(['irradiance cube']);
    expect(irrPlan.artifacts.filter((a) => a.willCompute).map((a) => a.kind)).toEqual(['irradiance']);
    // One level's budget: that level only.
    const samples = [0, 64, 64, 64, 64].map((s, m) => (m === 0 ? 64 : s));
    await baker.bake(recipe({ samples }));
    const changed = [...samples];
    changed[3] = 96;
    expect(computes(await baker.plan(recipe({ samples: changed })))).toEqual(['level 3']);
    const result = await baker.bake(recipe({ samples: changed }));
    expect(result.manifest.levels[3]!.samples).toBe(96);
    // The DFG table does not depend on the input.
    const other = equirectOf(() => [2, 2, 2], 64, 32);
    const otherPlan = await baker.plan({ ...recipe(), input: { bytes: other, name: 'grey.pfm' } });
    expect(otherPlan.stages.find((s) => s.kind === 'dfg')!.willCompute).toBe(false);
    expect(otherPlan.artifacts.find((a) => a.kind === 'lut')!.cached).toBe(true);
  });

  it('detects a corrupt entry by its hash and rebuilds it', async () => {
    const dir = tempDir();
    const baker = createBaker({ threads: 2, cache: dir });
    const first = await baker.bake(recipe());
    const store = new FolderStore(dir);
    const entries = await store.entries();
    for (const e of entries) {
      const path = join(dir, e.key.slice(0, 2), `${e.key}.entry`);
      const bytes = readFileSync(path);
      bytes[bytes.length >> 1] ^= 0xff;
      writeFileSync(path, bytes);
    }
    const again = await baker.bake(recipe());
    expect(again.cache.corrupt).toBeGreaterThan(0);
    expect(hashes(again)).toEqual(hashes(first));
    for (const e of await store.entries()) expect(decodeEntry((await store.get(e.key))!, e.key)).not.toBeNull();
  });

  it('lets two bakes of the same recipe run at once on one folder, leaving valid entries', async () => {
    const dir = tempDir();
    const a = createBaker({ threads: 2, cache: dir });
    const b = createBaker({ threads: 2, cache: dir });
    const [ra, rb] = await Promise.all([a.bake(recipe()), b.bake(recipe())]);
    expect(hashes(ra)).toEqual(hashes(rb));
    const store = new FolderStore(dir);
    for (const e of await store.entries()) expect(decodeEntry((await store.get(e.key))!, e.key)).not.toBeNull();
    expect(readdirSync(dir, { recursive: true }).filter((f) => String(f).includes('.tmp-'))).toEqual([]);
  });

  it('evicts least-recently-used entries down to the size limit', async () => {
    const dir = tempDir();
    const baker = createBaker({ threads: 2, cache: dir, cacheMaxBytes: 200_000 });
    await baker.bake(recipe());
    const total = (await new FolderStore(dir).entries()).reduce((n, e) => n + e.size, 0);
    expect(total).toBeLessThanOrEqual(200_000);
  });
});

describe('outputs', () => {
  it('writes every artifact atomically, readable by our codecs and ktx-parse, with a complete manifest', async () => {
    const out = tempDir();
    const baker = createBaker({ threads: 2, cache: false });
    const result = await baker.bake(recipe({ output: { views: ['hdr'] }, dfg: { size: 16, samples: 64, multiscatter: true } }), { outDir: out });
    const names = readdirSync(out).sort();
    expect(names).toEqual(['sky.dfg.ktx2', 'sky.irradiance.ktx2', 'sky.irradiance.hdr', 'sky.mirror.hdr', 'sky.probe.json', 'sky.specular.ktx2'].sort());
    const spec = readKtx2(readFileSync(join(out, 'sky.specular.ktx2')));
    expect([spec.vkFormat, spec.faceCount, spec.levels.length, spec.pixelWidth]).toEqual([97, 6, 5, 16]);
    const lut = decodeKtx2(readFileSync(join(out, 'sky.dfg.ktx2')));
    expect([lut.vkFormat, lut.width, lut.channels]).toEqual([97, 16, 4]);
    expect(lut.keyValues.get('lightkiln.channels')).toBe('A,B,Eavg,unused');
    const manifest = JSON.parse(readFileSync(join(out, 'sky.probe.json'), 'utf8'));
    expect(manifest.schemaVersion).toBe(1);
    expect(manifest.tool.name).toBe('lightkiln');
    expect(manifest.inputs[0].sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(manifest.recipe.rotationDeg).toBe(0);
    // The default spacing r_m = (m / (L - 1))^1.25.
    expect(manifest.levels.map((l: { roughness: number }) => l.roughness)).toEqual([0, 1, 2, 3, 4].map((m) => (m / 4) ** 1.25));
    expect(manifest.roughnessToLod).toBe('lod = (L - 1) * pow(r, 0.8), L = 5');
    expect(manifest.sh.radiance).toHaveLength(9);
    expect(manifest.sh.irradiance[0]).toHaveLength(3);
    for (const a of manifest.artifacts) expect(result.artifacts.find((b) => b.name === a.path)!.sha256).toBe(a.sha256);
    expect(manifest.sanitized).toEqual({ nan: 0, infinite: 0, negative: 0, clampedHigh: 0 });
  });

  it('aborting mid-bake rejects with ABORTED and leaves no artifact, temp file or broken cache entry', async () => {
    const out = tempDir();
    const cacheDir = tempDir();
    const baker = createBaker({ threads: 2, cache: cacheDir, targetTileCost: 2000 });
    const controller = new AbortController();
    const run = baker.bake(recipe({ size: 64, samples: 'high' }), {
      outDir: out, signal: controller.signal,
      onProgress: (p) => { if (p.stage === 'specular' && p.done > 0) controller.abort(); },
    });
    await expect(run).rejects.toMatchObject({ code: 'ABORTED' });
    expect(readdirSync(out)).toEqual([]);
    const store = new FolderStore(cacheDir);
    for (const e of await store.entries()) expect(decodeEntry((await store.get(e.key))!, e.key)).not.toBeNull();
    expect(readdirSync(cacheDir, { recursive: true }).filter((f) => String(f).includes('.tmp-'))).toEqual([]);
  });

  it('reports sanitised pixels and honours the reject policy', async () => {
    const data = new Float32Array(16 * 8 * 3).fill(1);
    data[5] = NaN; data[9] = Infinity; data[13] = -2;
    const bytes = encodeHdr({ width: 16, height: 8, channels: 3, data }); // RGBE cannot hold NaN: check via PFM
    expect(bytes.length).toBeGreaterThan(0);
    const { encodePfm } = await import('@lightkiln/codecs');
    const pfm = encodePfm({ width: 16, height: 8, channels: 3, data });
    const baker = createBaker({ threads: 0, cache: false });
    const result = await baker.bake({ input: { bytes: pfm, name: 'bad.pfm' }, size: 4, samples: 'draft', dfg: { enabled: false } });
    expect(result.manifest.sanitized).toEqual({ nan: 1, infinite: 1, negative: 1, clampedHigh: 0 });
    await expect(baker.bake({ input: { bytes: pfm, name: 'bad.pfm' }, size: 4, sanitize: { nonFinite: 'reject' } })).rejects.toThrow(/bad.pfm: 1 NaN and 1 infinite values/);
  });
});

describe('bad recipes and bad inputs', () => {
  const baker = createBaker({ threads: 0, cache: false });
  const cases: [string, Recipe, RegExp][] = [
    ['size not a power of two', recipe({ size: 100 }), /size: must be a power of two/],
    ['size too small', recipe({ size: 2 }), /size: .*4/],
    ['too many levels', recipe({ levels: 9 }), /levels: at most 5 levels for size 16/],
    ['roughness not starting at 0', recipe({ levels: 3, roughness: [0.1, 0.5, 1] }), /roughness: level 0 is the mirror level/],
    ['roughness not increasing', recipe({ levels: 3, roughness: [0, 0.5, 0.5] }), /roughness: values must increase/],
    ['samples list length', recipe({ samples: [1, 2] }), /samples: must list one count per level \(5\)/],
    ['unknown preset', recipe({ samples: 'ultra' as never }), /samples/],
    ['samples over the limit', recipe({ samples: 100_000 }), /samples.1: 100000 exceeds limits.maxSamples/],
    ['unknown field', { ...recipe(), colour: 'red' } as unknown as Recipe, /colour|Unrecognized/],
    ['unsafe name', recipe({ name: '../escape' }), /name: must be a plain file name/],
    ['no input', { input: {} } as Recipe, /input: give exactly one of path, bytes or faces/],
    ['bad format', recipe({ output: { specularFormat: 'bc6h' as never } }), /output.specularFormat/],
    ['work limit', recipe({ size: 64, quality: 'reference', limits: { maxWork: 1e6 } }), /over limits.maxWork/],
  ];
  for (const [label, bad, message] of cases) {
    it(`refuses ${label} with a message naming the field`, async () => {
      const error = await baker.bake(bad).catch((e: unknown) => e);
      expect(error).toBeInstanceOf(LightkilnError);
      expect((error as LightkilnError).code).toBe('INVALID_RECIPE');
      expect((error as LightkilnError).message).toMatch(message);
    });
  }

  it('refuses broken and missing inputs with the file name and writes nothing', async () => {
    const out = tempDir();
    const truncated = encodeHdr({ width: 32, height: 16, channels: 3, data: new Float32Array(32 * 16 * 3).fill(1) }).slice(0, 200);
    const error = await baker.bake({ input: { bytes: truncated, name: 'cut.hdr' } }, { outDir: out }).catch((e: unknown) => e) as LightkilnError;
    expect(error.code).toBe('INVALID_INPUT');
    expect(error.message).toMatch(/^cut.hdr: file is truncated/);
    expect(error.isUserError).toBe(true);
    expect(readdirSync(out)).toEqual([]);
    const missing = await baker.bake({ input: { path: join(out, 'nope.hdr') } }).catch((e: unknown) => e) as LightkilnError;
    expect(missing.code).toBe('INVALID_INPUT');
    expect(missing.message).toContain('nope.hdr');
    const limited = await baker.bake({ input: { bytes: skyBytes, name: 'sky.pfm' }, limits: { maxInputPixels: 100 } }).catch((e: unknown) => e) as LightkilnError;
    expect(limited.code).toBe('LIMIT_EXCEEDED');
  });

  it('starts the DFG table before the input is read, and stops it when the input cannot be read', async () => {
    const b = createBaker({ threads: 1, cache: false });
    const events: { type: string; stage?: string; state?: string }[] = [];
    await b.bake(recipe(), { onEvent: (e) => events.push(e) });
    const started = (stage: string): number => events.findIndex((e) => e.type === 'stage' && e.stage === stage && e.state === 'started');
    expect(started('dfg')).toBeGreaterThanOrEqual(0);
    expect(started('dfg')).toBeLessThan(started('decode'));
    // A missing input: the table's job stops at once (it computes nothing: no progress) and does not
    // outlive the failed bake (no event after the rejection).
    const during: { type: string }[] = [];
    const after: unknown[] = [];
    let failed = false;
    const error = await b.bake({ ...recipe(), input: { path: join(tempDir(), 'nope.hdr') }, dfg: { size: 256, samples: 64 } }, { onEvent: (e) => (failed ? after : during).push(e) }).catch((e: unknown) => e) as LightkilnError;
    failed = true;
    expect(error.code).toBe('INVALID_INPUT');
    expect(during.filter((e) => e.type === 'progress')).toEqual([]);
    await new Promise((r) => setTimeout(r, 300));
    expect(after).toEqual([]);
    await b.close();
  });

  it('holds a file that reports one size and reads another to the input limit', async () => {
    // Linux /proc files stat as 0 bytes and read as text (common practice: the limit must hold for the
    // bytes read, not only for the size reported beforehand).
    const proc = '/proc/self/status';
    if (!existsSync(proc)) return;
    const error = await baker.bake({ input: { path: proc }, limits: { maxInputBytes: 64 } }).catch((e: unknown) => e) as LightkilnError;
    expect(error.code).toBe('LIMIT_EXCEEDED');
    expect(error.message).toContain(proc);
  });

  it('refuses an output folder that is a symbolic link', async () => {
    const real = tempDir();
    const link = join(tempDir(), 'link');
    symlinkSync(real, link);
    await expect(baker.bake(recipe(), { outDir: link })).rejects.toMatchObject({ code: 'UNSAFE_PATH' });
    expect(existsSync(join(real, 'sky.probe.json'))).toBe(false);
  });

  it('validates baker options by name', () => {
    expect(() => createBaker({ threads: -2 })).toThrow(/option "threads" must be an integer in 0..256/);
    expect(() => createBaker({ cacheMaxBytes: -1 })).toThrow(/option "cacheMaxBytes"/);
  });
});

describe('option and callback faults', () => {
  const sky = encodePfm({ width: 16, height: 8, channels: 3, data: new Float32Array(16 * 8 * 3).fill(0.5) });
  const recipe: Recipe = { input: { bytes: sky, name: 'flat.pfm' }, size: 8, samples: 'draft' };

  it('a throwing onProgress rejects the bake with that error (pool threads and inline), never hangs', async () => {
    for (const threads of [0, 2]) {
      const baker = createBaker({ threads, cache: false });
      const err = await baker.bake(recipe, { onProgress: () => { throw new Error('boom'); } }).catch((e: unknown) => e);
      expect(err, `threads ${threads}`).toBeInstanceOf(LightkilnError);
      expect((err as LightkilnError).message).toContain('onProgress callback threw: boom');
      // The baker stays usable.
      expect((await baker.bake(recipe)).artifacts.length).toBeGreaterThan(2);
      await baker.close();
    }
  });

  it('rejects wrong option types with INVALID_OPTION, before any work', async () => {
    expect(() => createBaker({ cache: 42 as unknown as string })).toThrow(/option "cache"/);
    const baker = createBaker({ threads: 0, cache: false });
    for (const options of [{ outDir: 42 }, { onProgress: 'yes' }, { signal: {} }]) {
      const err = await baker.bake(recipe, options as never).catch((e: unknown) => e);
      expect((err as LightkilnError).code, JSON.stringify(options)).toBe('INVALID_OPTION');
    }
    await baker.close();
  });
});

describe('the work limit covers the irradiance convolution', () => {
  it('refuses a large irradiance cube under a small maxWork before any work', async () => {
    const sky = encodePfm({ width: 16, height: 8, channels: 3, data: new Float32Array(16 * 8 * 3).fill(0.5) });
    const baker = createBaker({ threads: 0, cache: false });
    // 6 x 256^2 irradiance texels x 6 x 64^2 source texels = 9.7e9 > 1e9.
    const err = await baker.bake({ input: { bytes: sky, name: 'flat.pfm' }, size: 64, samples: 'draft', irradiance: { cubeSize: 256 }, limits: { maxWork: 1e9 } }).catch((e: unknown) => e);
    expect((err as LightkilnError).code).toBe('INVALID_RECIPE');
    expect((err as LightkilnError).message).toContain('maxWork');
    await baker.close();
  });
});
