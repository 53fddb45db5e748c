/**
 * The CLI as build systems drive it, through a child process: the Make-syntax depfile, the up-to-date
 * stamp that lets an unchanged bake skip loading the bake, and --events JSON lines.
 */

import { existsSync, mkdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cliWorkspace, gradientSky } from './helpers/cli.js';
import { encodeHdr } from '@lightkiln/codecs';

const { work, skyPath, small: smallFlags, run } = cliWorkspace('lightkiln-cli-build-');
const small = [...smallFlags];
const sky = gradientSky;

describe('lightkiln bake for build systems', () => {
  it('writes a Make-syntax depfile: every artifact as a target, every file read as a prerequisite, escaped (GNU Make rules)', () => {
    const dir = join(work, 'dep $dir #1');
    mkdirSync(dir, { recursive: true });
    const input = join(dir, 'sky one.hdr');
    writeFileSync(input, readFileSync(skyPath));
    const recipeFile = join(dir, 'recipe.json');
    writeFileSync(recipeFile, JSON.stringify({ rotationDeg: 10 }));
    const depfile = join(work, 'single.d');
    const out = join(dir, 'out');
    expect(run(['bake', input, '--out', out, '--recipe', recipeFile, ...small, '--depfile', depfile]).status).toBe(0);
    const text = readFileSync(depfile, 'utf8');
    const esc = (p: string): string => p.replace(/\$/g, '$$$$').replace(/([ #])/g, '\\$1');
    const [targets, prereqs] = text.split(/:\s/);
    for (const name of ['sky_one.specular.ktx2', 'sky_one.irradiance.ktx2', 'sky_one.dfg.ktx2', 'sky_one.probe.json']) expect(targets).toContain(esc(join(out, name)));
    expect(prereqs).toContain(esc(input));
    expect(prereqs).toContain(esc(recipeFile));
    // A batch: its file and every entry's input are prerequisites.
    const batch = join(dir, 'batch.json');
    writeFileSync(batch, JSON.stringify([{ input: { path: 'sky one.hdr' }, name: 'p1' }, { input: { path: skyPath }, name: 'p2' }]));
    expect(run(['bake', '--batch', batch, '--out', out, ...small, '--depfile', depfile]).status).toBe(0);
    const batchText = readFileSync(depfile, 'utf8');
    expect(batchText).toContain(esc(batch));
    expect(batchText).toContain(esc(skyPath));
    expect(batchText).toContain(esc(join(out, 'p2.probe.json')));
  });

  it('replays an unchanged bake from its stamp, and bakes again when a file it read or wrote changed', () => {
    const dir = join(work, 'stamp');
    mkdirSync(dir, { recursive: true });
    const input = join(dir, 'sky.hdr');
    writeFileSync(input, readFileSync(skyPath));
    const out = join(dir, 'out');
    const depfile = join(dir, 'sky.d');
    const args = ['bake', input, '--out', out, '--size', '16', '--samples', 'draft', '--cache-dir', join(dir, 'cache'), '--depfile', depfile];
    const first = run(args);
    expect(first.status, first.stderr).toBe(0);
    expect(first.stderr).toContain('baked sky');
    const spec = join(out, 'sky.specular.ktx2');
    const bytes = readFileSync(spec);
    const mtime = statSync(spec).mtimeMs;
    const depText = readFileSync(depfile, 'utf8');
    // Unchanged: the same listing, nothing baked or written.
    const second = run(args);
    expect(second.status).toBe(0);
    expect(second.stderr).toContain('up to date');
    expect(second.stdout).toBe(first.stdout);
    expect(statSync(spec).mtimeMs).toBe(mtime);
    // A depfile deleted by the build system (Ninja, deps = gcc) is written again, still up to date.
    rmSync(depfile);
    expect(run(args).stderr).toContain('up to date');
    expect(readFileSync(depfile, 'utf8')).toBe(depText);
    // An artifact changed by someone else: the ordinary path restores it from the cache.
    writeFileSync(spec, Buffer.concat([bytes, Buffer.from([0])]));
    const third = run(args);
    expect(third.stderr).toContain('baked sky');
    expect(readFileSync(spec).equals(bytes)).toBe(true);
    // A different input under the same name: baked again.
    writeFileSync(input, encodeHdr({ width: 64, height: 32, channels: 3, data: sky(64, 32).map((v) => v * 2) }));
    const fourth = run(args);
    expect(fourth.stderr).toContain('baked sky');
    expect(readFileSync(spec).equals(bytes)).toBe(false);
    // --json and --no-cache always take the ordinary path.
    expect(run([...args, '--json']).stderr).not.toContain('up to date');
    // cache clear removes the stamps with the entries.
    expect(run(['cache', 'clear', '--cache-dir', join(dir, 'cache')]).status).toBe(0);
    expect(existsSync(join(dir, 'cache'))).toBe(false);
  });

  it('--events prints one JSON object per line: stages, cache hits and misses, artifacts written or kept', () => {
    const out = join(work, 'out-events');
    const cacheDir = join(work, 'cache-events');
    const args = ['bake', skyPath, '--out', out, '--size', '16', '--samples', 'draft', '--cache-dir', cacheDir, '--events'];
    const parse = (stderr: string): Record<string, unknown>[] => stderr.trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>);
    const first = run(args);
    expect(first.status, first.stderr).toBe(0);
    const e1 = parse(first.stderr);
    expect(e1.every((e) => e.probe === 'sky' && typeof e.t === 'number')).toBe(true);
    const stages = e1.filter((e) => e.type === 'stage');
    for (const s of new Set(stages.map((e) => e.stage))) {
      expect(stages.filter((e) => e.stage === s && e.state === 'started').length, String(s)).toBe(stages.filter((e) => e.stage === s && e.state === 'finished').length);
    }
    expect(e1.find((e) => e.type === 'cache' && e.entry === 'specular file')!.hit).toBe(false);
    expect(e1.filter((e) => e.type === 'artifact').every((e) => e.written === true)).toBe(true);
    const second = parse(run(args).stderr);
    expect(second.find((e) => e.type === 'cache' && e.entry === 'specular file')!.hit).toBe(true);
    expect(second.some((e) => e.type === 'stage')).toBe(false);
    expect(second.filter((e) => e.type === 'artifact').map((e) => e.written)).toEqual([false, false, false, false]);
  });
});
