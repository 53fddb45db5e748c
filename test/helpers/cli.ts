/** Running the built `lightkiln` command in a child process, and the small sky the CLI tests bake. */

import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll } from 'vitest';
import { encodeHdr } from '@lightkiln/codecs';

const root = fileURLToPath(new URL('../..', import.meta.url));
export const cli = join(root, 'packages/cli/dist/main.js');

export interface CliRun { status: number; stdout: string; stderr: string }

/** Runs `lightkiln ...args` in `cwd` (2 minutes at most). */
export function runCli(args: readonly string[], cwd: string): CliRun {
  const r = spawnSync(process.execPath, [cli, ...args], { cwd, encoding: 'utf8', timeout: 120_000, env: { ...process.env, NO_COLOR: '1' } });
  return { status: r.status ?? -1, stdout: r.stdout, stderr: r.stderr };
}

/** A vertical gradient with one bright pixel (a small sun at column 5, row 3). */
export function gradientSky(width: number, height: number): Float32Array {
  const data = new Float32Array(width * height * 3);
  for (let j = 0; j < height; j++) {
    for (let i = 0; i < width; i++) {
      const o = (j * width + i) * 3;
      data[o] = 1 + j / height; data[o + 1] = 0.6; data[o + 2] = 2 - j / height;
      if (i === 5 && j === 3) { data[o] = 3000; data[o + 1] = 2500; data[o + 2] = 2000; }
    }
  }
  return data;
}

/** A temporary folder for one CLI test file (removed after it), with the small sky written as sky.hdr. */
export interface CliWorkspace {
  readonly work: string;
  readonly skyPath: string;
  /** Flags for a quick bake without the cache. */
  readonly small: readonly string[];
  readonly run: (args: string[], cwd?: string) => CliRun;
}

export function cliWorkspace(prefix: string): CliWorkspace {
  const work = mkdtempSync(join(tmpdir(), prefix));
  afterAll(() => rmSync(work, { recursive: true, force: true }));
  const skyPath = join(work, 'sky.hdr');
  writeFileSync(skyPath, encodeHdr({ width: 64, height: 32, channels: 3, data: gradientSky(64, 32) }));
  return { work, skyPath, small: ['--size', '16', '--samples', 'draft', '--no-cache'], run: (args, cwd = work) => runCli(args, cwd) };
}
