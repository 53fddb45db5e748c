/**
 * End-to-end tests of the lightkiln command through a child process: the CLI contract of the README (one JSON
 * document on stdout with --json, progress on stderr, exit codes 0 / 1 / 2), batches, inspect on every
 * format, the cache command, the demo scene and Ctrl-C.
 */

import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import { encodeExr, encodePfm, encodePng } from '@lightkiln/codecs';
import { cli, cliWorkspace, gradientSky } from './helpers/cli.js';

const root = fileURLToPath(new URL('..', import.meta.url));
const { work, skyPath, small: smallFlags, run } = cliWorkspace('lightkiln-cli-');
const small = [...smallFlags];
const sky = gradientSky;

describe('lightkiln bake', () => {
  it('prints exactly one JSON document with --json, progress only on stderr, exit 0', () => {
    const out = join(work, 'out-json');
    const r = run(['bake', skyPath, '--out', out, ...small, '--json']);
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.artifacts.map((a: { kind: string }) => a.kind).sort()).toEqual(['irradiance', 'lut', 'manifest', 'specular']);
    for (const a of doc.artifacts) {
      expect(a.sha256).toMatch(/^[0-9a-f]{64}$/);
      expect(existsSync(a.path)).toBe(true);
    }
    expect(r.stderr).toContain('baked sky');
  });

  it('prints nothing on stderr with --quiet', () => {
    const r = run(['bake', skyPath, '--out', join(work, 'out-quiet'), ...small, '--quiet']);
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
  });

  it('exits 2 with the command usage on bad usage', () => {
    for (const args of [['bake', skyPath], ['bake', '--out', work], ['bake', skyPath, '--out', work, '--size', 'big'], ['bake', skyPath, '--out', work, '--bogus'], ['frobnicate']]) {
      const r = run(args);
      expect(r.status, args.join(' ')).toBe(2);
      expect(r.stderr).toMatch(/usage: lightkiln|lightkiln: bake HDR/);
      expect(r.stdout).toBe('');
    }
  });

  it('exits 2 naming the file and the reason on a bad input, writing nothing', () => {
    const bad = join(work, 'broken.hdr');
    writeFileSync(bad, readFileSync(skyPath).subarray(0, 80));
    const out = join(work, 'out-bad');
    const r = run(['bake', bad, '--out', out, ...small, '--json']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain(`${bad}: file is truncated`);
    expect(JSON.parse(r.stdout).probes[0].error.code).toBe('INVALID_INPUT');
    expect(existsSync(out) ? readdirSync(out) : []).toEqual([]);
    const bigSize = run(['bake', skyPath, '--out', out, '--size', '100', '--no-cache']);
    expect(bigSize.status).toBe(2);
    expect(bigSize.stderr).toMatch(/size: must be a power of two/);
  });

  it('bakes a batch, reports the failing probe and goes on (exit 1)', () => {
    const batch = join(work, 'batch.json');
    writeFileSync(join(work, 'also.pfm'), encodePfm({ width: 32, height: 16, channels: 3, data: sky(32, 16) }));
    writeFileSync(join(work, 'broken.hdr'), '#?RADIANCE\nFORMAT=32-bit_rle_rgbe\n\n-Y 16 +X 32\n\u0002\u0002');
    writeFileSync(batch, JSON.stringify([
      { input: { path: 'sky.hdr' }, name: 'first' },
      { input: { path: 'broken.hdr' }, name: 'second' },
      { input: { path: 'also.pfm' }, name: 'third', rotationDeg: 45 },
    ]));
    const out = join(work, 'out-batch');
    const r = run(['bake', '--batch', batch, '--out', out, ...small, '--json']);
    expect(r.status).toBe(1);
    const doc = JSON.parse(r.stdout);
    expect(doc.probes.map((p: { ok: boolean }) => p.ok)).toEqual([true, false, true]);
    expect(doc.probes[1].error.message).toContain('broken.hdr');
    expect(existsSync(join(out, 'first.probe.json'))).toBe(true);
    expect(JSON.parse(readFileSync(join(out, 'third.probe.json'), 'utf8')).recipe.rotationDeg).toBe(45);
  });

  it('checks every batch entry before any work: a missing input, a duplicate name or an unsafe name stop it (exit 2, nothing written)', () => {
    const cases: [string, unknown[], string][] = [
      ['missing', [{ input: { path: 'sky.hdr' }, name: 'one' }, { input: { path: 'missing.hdr' }, name: 'two' }], 'missing.hdr'],
      ['duplicate', [{ input: { path: 'sky.hdr' } }, { input: { path: 'sky.hdr' } }], 'also used by entry 0'],
      ['escape', [{ input: { path: 'sky.hdr' }, name: 'ok' }, { input: { path: 'sky.hdr' }, name: '../escape' }], 'plain file name'],
    ];
    for (const [label, entries, message] of cases) {
      const batch = join(work, `pre-${label}.json`);
      writeFileSync(batch, JSON.stringify(entries));
      const out = join(work, `out-pre-${label}`);
      const r = run(['bake', '--batch', batch, '--out', out, ...small, '--json']);
      expect(r.status, label).toBe(2);
      expect(JSON.parse(r.stdout).error.message, label).toContain(message);
      expect(existsSync(out), label).toBe(false);
    }
  });

  it('refuses a symbolic link at an artifact path before baking (exit 2) and leaves its target alone', () => {
    const out = join(work, 'out-link');
    mkdirSync(out, { recursive: true });
    const victim = join(work, 'victim.txt');
    writeFileSync(victim, 'keep');
    symlinkSync(victim, join(out, 'sky.probe.json'));
    const r = run(['bake', skyPath, '--out', out, ...small]);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('symbolic link');
    expect(readFileSync(victim, 'utf8')).toBe('keep');
    expect(readdirSync(out)).toEqual(['sky.probe.json']);
  });

  it('sweep refuses a symbolic link planted at its report path before running', () => {
    const out = join(work, 'out-sweep-link');
    mkdirSync(out, { recursive: true });
    const victim = join(work, 'victim-sweep.txt');
    writeFileSync(victim, 'keep');
    symlinkSync(victim, join(out, 'sky.sweep.csv'));
    const r = run(['sweep', skyPath, '--out', out, '--size', '8', '--budgets', '16', '--methods', 'plain', '--repeats', '1', '--quiet']);
    expect(r.status).toBe(2);
    expect(readFileSync(victim, 'utf8')).toBe('keep');
  });

  it('prints a JSON error document on stdout for a usage error with --json', () => {
    const r = run(['bake', skyPath, '--bogus', '--json']);
    expect(r.status).toBe(2);
    expect(JSON.parse(r.stdout).error.code).toBe('USAGE');
  });

  it('cache clear refuses a folder that is not a cache and deletes only what the cache owns', () => {
    const folder = join(work, 'not-a-cache');
    mkdirSync(folder, { recursive: true });
    writeFileSync(join(folder, 'precious.txt'), 'keep');
    for (const action of ['clear', 'prune', 'verify']) {
      const r = run(['cache', action, '--cache-dir', folder, ...(action === 'prune' ? ['--max-bytes', '0'] : [])]);
      expect(r.status, action).toBe(2);
      expect(r.stderr, action).toContain('not a lightkiln cache');
    }
    expect(readFileSync(join(folder, 'precious.txt'), 'utf8')).toBe('keep');
    // A real cache with a stranger's file in it: clear removes the entries and keeps the folder and the file.
    const cacheDir = join(work, 'cache-with-stranger');
    expect(run(['bake', skyPath, '--out', join(work, 'out-stranger'), '--size', '8', '--samples', 'draft', '--cache-dir', cacheDir]).status).toBe(0);
    writeFileSync(join(cacheDir, 'notes.txt'), 'mine');
    const cleared = run(['cache', 'clear', '--cache-dir', cacheDir, '--json']);
    expect(cleared.status).toBe(0);
    expect(JSON.parse(cleared.stdout).removed).toBeGreaterThan(3);
    expect(readdirSync(cacheDir)).toEqual(['notes.txt']);
  });

  it('cache verify names the corrupt entries, and an entry copied over another fails (the checksum binds the key)', () => {
    const cacheDir = join(work, 'cache-verify');
    expect(run(['bake', skyPath, '--out', join(work, 'out-verify'), '--size', '8', '--samples', 'draft', '--cache-dir', cacheDir]).status).toBe(0);
    const files = readdirSync(cacheDir).filter((d) => /^[0-9a-f]{2}$/.test(d)).flatMap((d) => readdirSync(join(cacheDir, d)).map((f) => join(cacheDir, d, f)));
    const [a, b] = files;
    writeFileSync(b!, readFileSync(a!));
    const r = run(['cache', 'verify', '--cache-dir', cacheDir, '--json']);
    expect(r.status).toBe(1);
    const doc = JSON.parse(r.stdout);
    expect(doc.corrupt).toBe(1);
    expect(doc.corruptEntries).toEqual([b!.split('/').pop()!.replace('.entry', '')]);
  });

  it('sweeps stale temp files of dead processes and counts them in cache stats', () => {
    const cacheDir = join(work, 'cache-temps');
    expect(run(['bake', skyPath, '--out', join(work, 'out-temps'), '--size', '8', '--samples', 'draft', '--cache-dir', cacheDir]).status).toBe(0);
    const shard = readdirSync(cacheDir).find((d) => /^[0-9a-f]{2}$/.test(d))!;
    // pid 2^22 + 1 is above Linux's pid_max ceiling, so no process has it.
    const stale = join(cacheDir, shard, `.${'0'.repeat(64)}.entry.tmp-4194305-abcdef`);
    writeFileSync(stale, new Uint8Array(1000));
    const staleOut = join(work, 'out-temps', '.sky.probe.json.tmp-4194305-abcdef');
    writeFileSync(staleOut, 'x');
    const stats = JSON.parse(run(['cache', 'stats', '--cache-dir', cacheDir, '--json']).stdout);
    expect(stats.staleTempFiles).toBe(1);
    expect(stats.staleTempBytes).toBe(1000);
    expect(run(['cache', 'verify', '--cache-dir', cacheDir]).status).toBe(0);
    expect(existsSync(stale)).toBe(false);
    // The next bake into the output folder sweeps that folder's stale temp files.
    expect(run(['bake', skyPath, '--out', join(work, 'out-temps'), '--size', '8', '--samples', 'draft', '--no-cache']).status).toBe(0);
    expect(existsSync(staleOut)).toBe(false);
  });

  it('uses the cache: the second run reads every file from it', () => {
    const cacheDir = join(work, 'cache');
    const args = ['bake', skyPath, '--out', join(work, 'out-cache'), '--size', '16', '--samples', 'draft', '--cache-dir', cacheDir, '--json'];
    expect(run(args).status).toBe(0);
    const second = JSON.parse(run(args).stdout);
    expect(second.probes[0].cache.writes).toBe(0);
    const stats = JSON.parse(run(['cache', 'stats', '--cache-dir', cacheDir, '--json']).stdout);
    expect(stats.entries).toBeGreaterThan(5);
    expect(JSON.parse(run(['cache', 'verify', '--cache-dir', cacheDir, '--json']).stdout).corrupt).toBe(0);
    const pruned = JSON.parse(run(['cache', 'prune', '--max-bytes', '1000', '--cache-dir', cacheDir, '--json']).stdout);
    expect(pruned.totalBytes).toBeLessThanOrEqual(1000);
    expect(run(['cache', 'clear', '--cache-dir', cacheDir]).status).toBe(0);
    expect(existsSync(cacheDir)).toBe(false);
    expect(run(['cache', 'prune', '--cache-dir', cacheDir]).status).toBe(2);
  });

  for (const signal of ['SIGINT', 'SIGTERM'] as const) it(`aborts cleanly on ${signal}: exit 1, no artifact and no temp file`, async () => {
    const out = join(work, `out-${signal}`);
    const child = spawn(process.execPath, [cli, 'bake', skyPath, '--out', out, '--size', '512', '--no-cache'], { cwd: work, env: { ...process.env, NO_COLOR: '1' } });
    let stderr = '';
    const code = await new Promise<number>((resolve) => {
      child.stderr.on('data', (chunk: Buffer) => {
        stderr += chunk.toString();
        if (stderr.includes('specular') && !child.killed) child.kill(signal);
      });
      // The specular stage of this bake (512, the default quadrature) takes several seconds.
      setTimeout(() => { if (!child.killed) child.kill(signal); }, 4000);
      child.on('exit', (c) => resolve(c ?? -1));
    });
    expect(code).toBe(1);
    expect(stderr).toContain('interrupted');
    expect(existsSync(out) ? readdirSync(out) : []).toEqual([]);
  });
});

describe('lightkiln lut', () => {
  it('writes a KTX 2.0 table and reports it as JSON', () => {
    const file = join(work, 'tables', 'dfg.ktx2');
    const r = run(['lut', '--out', file, '--size', '16', '--samples', '64', '--multiscatter', '--no-cache', '--json']);
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.artifacts[0]).toMatchObject({ kind: 'lut', path: file });
    expect(readFileSync(file).subarray(1, 7).toString('latin1')).toBe('KTX 20');
    expect(run(['lut', '--out', join(work, 'x.png')]).status).toBe(2);
  });
});

describe('lightkiln inspect', () => {
  it('summarises every format we read or write', () => {
    const out = join(work, 'out-inspect');
    expect(run(['bake', skyPath, '--out', out, ...small, '--views']).status).toBe(0);
    writeFileSync(join(work, 'i.exr'), encodeExr({ width: 8, height: 4, channels: 3, data: sky(8, 4) }));
    writeFileSync(join(work, 'i.pfm'), encodePfm({ width: 8, height: 4, channels: 3, data: sky(8, 4) }));
    writeFileSync(join(work, 'i.png'), encodePng({ width: 2, height: 2, channels: 3, data: new Uint8Array(12) }));
    expect(PNG.sync.read(readFileSync(join(work, 'i.png'))).width).toBe(2);
    const files = ['sky.specular.ktx2', 'sky.dfg.ktx2', 'sky.probe.json', 'sky.mirror.hdr'].map((f) => join(out, f)).concat(['i.exr', 'i.pfm', 'i.png'].map((f) => join(work, f)));
    const r = run(['inspect', ...files, '--json']);
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.files.map((f: { format: string }) => f.format)).toEqual(['ktx2', 'ktx2', 'manifest', 'hdr', 'exr', 'pfm', 'png']);
    // A 16 cube's default chain: 16, 8, 4 (r = 0, 0.5^1.25, 1).
    expect(doc.files[0].details.levels[1].roughness).toBeCloseTo(0.5 ** 1.25, 12);
    expect(doc.files[0].details.dataFormatDescriptor.transfer).toBe('linear');
    expect(doc.files[2].details.sh.radiance).toHaveLength(9);
    const text = run(['inspect', join(out, 'sky.specular.ktx2')]);
    expect(text.stdout).toContain('VK_FORMAT_R16G16B16A16_SFLOAT (97)');
    const junk = join(work, 'junk.bin');
    writeFileSync(junk, 'hello');
    const bad = run(['inspect', junk]);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain(`${junk}: unknown file type`);
  });
});

describe('lightkiln preview', () => {
  it('writes the contact sheet with bake --preview and from a manifest, decodable by pngjs', () => {
    const out = join(work, 'out-preview');
    const r = run(['bake', skyPath, '--out', out, ...small, '--preview', '--json']);
    expect(r.status, r.stderr).toBe(0);
    expect(JSON.parse(r.stdout).artifacts.map((a: { kind: string }) => a.kind)).toContain('preview');
    const sheet = PNG.sync.read(readFileSync(join(out, 'sky.preview.png')));
    expect(sheet.width).toBeGreaterThan(500);
    const file = join(work, 'sheet.png');
    const p = run(['preview', join(out, 'sky.probe.json'), '--out', file, '--exposure', '1']);
    expect(p.status, p.stderr).toBe(0);
    const again = PNG.sync.read(readFileSync(file));
    expect([again.width, again.height]).toEqual([sheet.width, sheet.height]);
    // One stop brighter: the sheet's mean brightness rises.
    const mean = (png: PNG): number => png.data.reduce((a, v) => a + v, 0) / png.data.length;
    expect(mean(again)).toBeGreaterThan(mean(sheet));
    expect(run(['preview', join(work, 'nope.json'), '--out', file]).status).toBe(2);
  });
});

describe('lightkiln sweep', () => {
  it('writes CSV, Markdown, SVG and JSON and prints one JSON document', () => {
    const out = join(work, 'out-sweep');
    const r = run(['sweep', skyPath, '--out', out, '--size', '8', '--budgets', '16,256,default', '--methods', 'plain,filtered', '--repeats', '1', '--json', '--quiet']);
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.artifacts.map((a: { kind: string }) => a.kind)).toEqual(['sweep-csv', 'sweep-markdown', 'sweep-svg', 'sweep-json']);
    expect(doc.points).toHaveLength(6);
    expect(readFileSync(join(out, 'sky.sweep.svg'), 'utf8')).toContain('<svg');
    expect(run(['sweep', skyPath, '--out', out, '--budgets', '16,lots']).status).toBe(2);
    expect(run(['sweep', skyPath, '--out', out, '--methods', 'guess']).status).toBe(2);
  });
});

describe('the demo scene (examples/observatory-dusk)', () => {
  it('generates the sky with our own script and bakes it with the default preset', () => {
    const hdr = join(work, 'dusk.hdr');
    const gen = spawnSync(process.execPath, [join(root, 'examples/observatory-dusk/make-sky.mjs'), hdr, '256'], { encoding: 'utf8' });
    expect(gen.status, gen.stderr).toBe(0);
    const r = run(['bake', hdr, '--out', join(work, 'out-demo'), '--size', '32', '--no-cache', '--json']);
    expect(r.status, r.stderr).toBe(0);
    const manifest = JSON.parse(readFileSync(join(work, 'out-demo', 'dusk.probe.json'), 'utf8'));
    expect(manifest.recipe.samplePreset).toBe('default');
    // The sun is far brighter than anything else: the mirror level keeps a very bright texel.
    const insp = JSON.parse(run(['inspect', join(work, 'out-demo', 'dusk.specular.ktx2'), '--json']).stdout);
    expect(insp.files[0].details.levels[0].max).toBeGreaterThan(100);
  });
});
