/** Every example runs here, on environments our own demo script generates. */

import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { closeSharedPools } from '@lightkiln/bake';
import { cook } from './asset-cooker/cook.mjs';
import { bakeWithTimeout } from './progress-and-timeout/bake-with-timeout.mjs';
import { compareBudgets } from './compare-budgets/compare.mjs';
import { hasTool } from '../test/helpers/tools.js';

const here = fileURLToPath(new URL('.', import.meta.url));
const work = mkdtempSync(join(tmpdir(), 'lightkiln-examples-'));
const sky = join(work, 'dusk.hdr');
const gen = spawnSync(process.execPath, [join(here, 'observatory-dusk/make-sky.mjs'), sky, '256'], { encoding: 'utf8' });
afterAll(async () => {
  rmSync(work, { recursive: true, force: true });
  await closeSharedPools();
});

describe('examples', () => {
  it('observatory-dusk generates the demo sky', () => {
    expect(gen.status, gen.stderr).toBe(0);
  });

  it('asset-cooker bakes a folder, then skips what did not change and rebakes only what did', async () => {
    const folder = join(work, 'probes');
    const { mkdirSync } = await import('node:fs');
    mkdirSync(folder);
    copyFileSync(sky, join(folder, 'a.hdr'));
    expect(spawnSync(process.execPath, [join(here, 'observatory-dusk/make-sky.mjs'), join(folder, 'b.hdr'), '128']).status).toBe(0);
    const out = join(work, 'cooked');
    const cache = join(work, 'cache');
    const fields = { size: 16, samples: 'draft' };
    const first = await cook(folder, out, cache, fields);
    expect(first.map((r: { action: string }) => r.action)).toEqual(['baked', 'baked']);
    const second = await cook(folder, out, cache, fields);
    expect(second.map((r: { action: string }) => r.action)).toEqual(['from cache', 'from cache']);
    expect(second[0].recomputed).toEqual([]);
    // Replace one file with another sky: only that probe is rebaked, from the source up.
    const other = spawnSync(process.execPath, [join(here, 'observatory-dusk/make-sky.mjs'), join(folder, 'b.hdr'), '192'], { encoding: 'utf8' });
    expect(other.status).toBe(0);
    const third = await cook(folder, out, cache, fields);
    expect(third.map((r: { action: string }) => r.action)).toEqual(['from cache', 'baked']);
    expect(third[1].recomputed).toContain('source');
    // A recipe change (rotation) rebakes both, reusing the decoded sources from the cache.
    const fourth = await cook(folder, out, cache, { ...fields, rotationDeg: 30 });
    expect(fourth.map((r: { action: string }) => r.action)).toEqual(['baked', 'baked']);
    expect(fourth[0].recomputed).not.toContain('source');
    expect(fourth[0].recomputed).toContain('pyramid');
    expect(readdirSync(out).filter((f) => f.endsWith('.probe.json')).sort()).toEqual(['a.probe.json', 'b.probe.json']);
  });

  it('progress-and-timeout reports stages and aborts cleanly when the time budget runs out', async () => {
    const lines: string[] = [];
    const ok = await bakeWithTimeout({ input: { path: sky }, size: 16, samples: 'draft' }, join(work, 'timed'), 60_000, (l: string) => lines.push(l));
    expect(ok.ok).toBe(true);
    expect(ok.stages).toEqual(expect.arrayContaining(['resample', 'specular', 'irradiance', 'dfg']));
    const outDir = join(work, 'timed-out');
    const late = await bakeWithTimeout({ input: { path: sky }, size: 256, samples: 'high' }, outDir, 300);
    expect(late).toMatchObject({ ok: false, aborted: true });
    const { existsSync } = await import('node:fs');
    expect(existsSync(outDir) ? readdirSync(outDir) : []).toEqual([]);
  });

  // The reference mode reads the level-0 cube bilinearly; the quadrature weights each texel where its light
  // is. At 32 x 32 faces those two readings of the same cube differ, so only the budgets are ranked here
  // (packages/bake/test/sunny.test.ts measures the quadrature against the exact convolution).
  it('compare-budgets shows the larger budget closer to the reference and reports the quadrature', async () => {
    const rows = await compareBudgets({ path: sky }, 32, [32, 512, 'quadrature']);
    expect(rows).toHaveLength(3);
    const mean = (v: number[]): number => v.slice(1).reduce((a, b) => a + b, 0) / (v.length - 1);
    expect(mean(rows[1].relativeRmse)).toBeLessThan(mean(rows[0].relativeRmse));
    expect(rows[2].relativeRmse.length).toBe(rows[0].relativeRmse.length);
  });
});

describe('ninja-cooker (Debian ninja-build)', () => {
  it.runIf(hasTool('ninja'))('bakes on the first run, does nothing on the second, reruns only a touched probe (artifacts unchanged, mtimes kept), then nothing', async () => {
    const { mkdirSync, readFileSync, statSync, utimesSync, writeFileSync } = await import('node:fs');
    const dir = join(work, 'ninja');
    mkdirSync(join(dir, 'probes'), { recursive: true });
    const cli = join(here, '../packages/cli/dist/main.js');
    writeFileSync(join(dir, 'build.ninja'), readFileSync(join(here, 'ninja-cooker/build.ninja'), 'utf8').replace(/^lightkiln = .*$/m, `lightkiln = "${process.execPath}" "${cli}"`));
    copyFileSync(sky, join(dir, 'probes/sunset.hdr'));
    expect(spawnSync(process.execPath, [join(here, 'observatory-dusk/make-sky.mjs'), join(dir, 'probes/noon.hdr'), '128']).status).toBe(0);
    const ninja = (): string => {
      const r = spawnSync('ninja', [], { cwd: dir, encoding: 'utf8' });
      expect(r.status, r.stderr + r.stdout).toBe(0);
      return r.stdout;
    };
    const first = ninja();
    expect(first).toContain('cook sunset');
    expect(first).toContain('cook noon');
    expect(ninja()).toContain('no work to do');
    const spec = join(dir, 'cooked/noon.specular.ktx2');
    const before = statSync(spec).mtimeMs;
    // Touch the input (a later mtime, same bytes): only that probe reruns, and restat sees unchanged files.
    const later = new Date(Date.now() + 5000);
    utimesSync(join(dir, 'probes/noon.hdr'), later, later);
    const third = ninja();
    expect(third).toContain('cook noon');
    expect(third).not.toContain('cook sunset');
    expect(statSync(spec).mtimeMs).toBe(before);
    expect(ninja()).toContain('no work to do');
  }, 120_000);
});
