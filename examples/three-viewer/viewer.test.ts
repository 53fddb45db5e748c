/**
 * The three.js viewer in headless Chromium (Debian `chromium`, driven by playwright-core; WebGL 2 on
 * SwiftShader, the CPU rasteriser): the sphere grid it draws from the KTX 2.0 files, through three's
 * KTX2Loader, our CubeTexture helper and our split-sum shader, against the spheres of the contact sheet
 * lightkiln shades on the CPU from the same files. Two independent paths to the same picture: GPU
 * filtering (seamless trilinear cube sampling, linear DFG lookups) against the sheet's own lookups.
 */

import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import { hasTool } from '../../test/helpers/tools.js';
import { startViewerServer } from './serve.mjs';

const here = fileURLToPath(new URL('.', import.meta.url));
const repo = join(here, '..', '..');
const work = mkdtempSync(join(tmpdir(), 'lightkiln-viewer-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

// The contact sheet's layout (packages/bake/src/preview/sheet.ts): where its ten spheres are.
const CELL = 40;
const PAD = 10;
const LABEL_H = 7 * 2 + 6;
const CROSS_W = 4 * CELL;
const CROSS_H = 3 * CELL;
const CELL_W = CROSS_W + PAD;
const CELL_H = CROSS_H + LABEL_H + PAD;
const SPHERE = 96;
const TITLE_H = 7 * 3 + 2 * PAD;
const SPHERE_ROW_H = SPHERE + 2 * LABEL_H + PAD;

function sheetSphereOrigin(levels: number, row: number, col: number): [number, number] {
  const rows = Math.ceil(levels / 5);
  const row2 = TITLE_H + rows * CELL_H;
  const oy = row2 + LABEL_H + CROSS_H + PAD + row * SPHERE_ROW_H + LABEL_H;
  const ox = PAD + col * CELL_W + (CROSS_W - SPHERE) / 2;
  return [ox, oy];
}

/** The tEXt chunks of a PNG (PNG specification, ISO/IEC 15948, 11.3.4.3: keyword, NUL, text). */
function pngText(bytes: Buffer): Record<string, string> {
  const out: Record<string, string> = {};
  for (let o = 8; o + 8 <= bytes.length;) {
    const length = bytes.readUInt32BE(o);
    const type = bytes.toString('latin1', o + 4, o + 8);
    if (type === 'tEXt') {
      const body = bytes.subarray(o + 8, o + 8 + length);
      const nul = body.indexOf(0);
      out[body.toString('latin1', 0, nul)] = body.toString('latin1', nul + 1);
    }
    o += 12 + length;
  }
  return out;
}

const chromium = hasTool('chromium') ? 'chromium' : null;

describe('three.js viewer (headless Chromium, WebGL 2 on SwiftShader)', () => {
  it.skipIf(chromium === null)('draws the spheres the contact sheet shades on the CPU', async () => {
    const sky = join(work, 'dusk.hdr');
    expect(spawnSync(process.execPath, [join(repo, 'examples/observatory-dusk/make-sky.mjs'), sky, '512']).status).toBe(0);
    const bake = spawnSync(process.execPath, [join(repo, 'packages/cli/dist/main.js'), 'bake', sky, '--out', work, '--size', '128', '--preview', '--zstd', '--no-cache', '--quiet'], { encoding: 'utf8' });
    expect(bake.status, bake.stderr).toBe(0);
    const manifest = JSON.parse(readFileSync(join(work, 'dusk.probe.json'), 'utf8'));
    const sheet = PNG.sync.read(readFileSync(join(work, 'dusk.preview.png')));

    const { chromium: browserType } = await import('playwright-core');
    const server = await startViewerServer(work);
    const browser = await browserType.launch({
      executablePath: spawnSync('sh', ['-c', 'command -v chromium'], { encoding: 'utf8' }).stdout.trim(),
      args: ['--use-gl=angle', '--use-angle=swiftshader', '--enable-unsafe-swiftshader', '--no-sandbox'],
    });
    try {
      const page = await browser.newPage();
      const logs: string[] = [];
      page.on('console', (m) => logs.push(m.text()));
      page.on('pageerror', (e) => logs.push(String(e)));
      await page.goto(`${server.url}?probe=dusk`);
      await page.waitForFunction(() => (window as unknown as { lightkilnViewer?: unknown }).lightkilnViewer !== undefined, undefined, { timeout: 60_000 });
      const view = await page.evaluate(() => (window as unknown as { lightkilnViewer: Record<string, unknown> }).lightkilnViewer) as {
        error?: string; width: number; height: number; exposure: number; rgb: number[]; glError: number; renderer: string;
      };
      expect(view.error, logs.join('\n')).toBeUndefined();
      expect(view.glError, logs.join("\n")).toBe(0);
      // The viewer's automatic exposure is the sheet's (both from level 0 of the same file).
      const sheetExposure = Number(pngText(readFileSync(join(work, 'dusk.preview.png')))['lightkiln:exposure']);
      expect(Math.abs(view.exposure / sheetExposure - 1)).toBeLessThan(1e-5);

      const levels = manifest.levels.length;
      const diffs: number[] = [];
      for (let row = 0; row < 2; row++) {
        for (let col = 0; col < 5; col++) {
          const [ox, oy] = sheetSphereOrigin(levels, row, col);
          for (let y = 0; y < SPHERE; y++) {
            for (let x = 0; x < SPHERE; x++) {
              const nx = (x + 0.5 - SPHERE / 2) / (SPHERE / 2);
              const ny = (y + 0.5 - SPHERE / 2) / (SPHERE / 2);
              if (nx * nx + ny * ny >= 1) continue;
              const s = ((oy + y) * sheet.width + ox + x) * 4;
              const v = ((row * SPHERE + y) * view.width + col * SPHERE + x) * 3;
              for (let c = 0; c < 3; c++) diffs.push(Math.abs(sheet.data[s + c]! - view.rgb[v + c]!));
            }
          }
        }
      }
      diffs.sort((a, b) => a - b);
      const mean = diffs.reduce((a, b) => a + b, 0) / diffs.length;
      const p99 = diffs[Math.floor(0.99 * diffs.length)]!;
      const max = diffs[diffs.length - 1]!;
      console.log(`viewer vs contact sheet (${view.renderer}): ${diffs.length / 3} sphere pixels, mean ${mean.toFixed(3)}, p99 ${p99}, max ${max} (8-bit sRGB levels)`);
      expect(mean).toBeLessThan(0.5);
      expect(p99).toBeLessThanOrEqual(2);
      expect(max).toBeLessThanOrEqual(8);
    } finally {
      await browser.close();
      await server.close();
    }
  });
});
