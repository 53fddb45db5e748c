/**
 * The farm end to end with real servers (Debian redis-server and nginx, on free loopback ports, stopped by
 * PID): two `lightkiln farm worker` processes, two `lightkiln farm submit` of the same batch at once. Every
 * probe is baked exactly once, every artifact arrives, byte-identical to a local bake; a worker killed with
 * SIGKILL mid-job has its job finished by the other one.
 */

import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { encodePfm } from '@lightkiln/codecs';
import { disposeDavServer, startDavServer, type DavServer } from './helpers/nginx.js';
import { startRedis, type RedisServer } from './helpers/redis.js';
import { hasTool } from './helpers/tools.js';

const cli = fileURLToPath(new URL('../packages/cli/dist/main.js', import.meta.url));
const work = mkdtempSync(join(tmpdir(), 'lightkiln-farm-'));
const enabled = hasTool('redis-server') && hasTool('nginx');
let redis: RedisServer | null = null;
let dav: DavServer | null = null;
const workers: { child: ChildProcess; log: string[] }[] = [];

afterAll(async () => {
  for (const w of workers) if (w.child.exitCode === null) w.child.kill('SIGKILL');
  if (redis !== null) await redis.stop();
  if (dav !== null) await disposeDavServer(dav);
  rmSync(work, { recursive: true, force: true });
});

function sky(width: number, height: number, tint: number): Uint8Array {
  const data = new Float32Array(width * height * 3);
  for (let j = 0; j < height; j++) for (let i = 0; i < width; i++) {
    const o = (j * width + i) * 3;
    data[o] = 1 + tint * (i / width); data[o + 1] = 0.5 + j / height; data[o + 2] = 0.3;
  }
  return encodePfm({ width, height, channels: 3, data });
}

function startWorker(index: number, queue: string, extra: string[] = []): { child: ChildProcess; log: string[] } {
  const log: string[] = [];
  const child = spawn(process.execPath, [cli, 'farm', 'worker', '--redis', redis!.url, '--remote-cache', dav!.url, '--queue', queue, '--threads', '1', '--cache-dir', join(work, `worker-cache-${index}-${queue}`), ...extra], { stdio: ['ignore', 'ignore', 'pipe'] });
  child.stderr!.on('data', (chunk: Buffer) => log.push(...chunk.toString().split('\n').filter((l) => l !== '')));
  const w = { child, log };
  workers.push(w);
  return w;
}

async function waitFor(cond: () => boolean, ms: number): Promise<void> {
  const until = Date.now() + ms;
  while (!cond()) {
    if (Date.now() > until) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 50));
  }
}

function submit(batch: string, out: string, queue: string, extra: readonly string[] = []): Promise<{ status: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [cli, 'farm', 'submit', '--batch', batch, '--redis', redis!.url, '--remote-cache', dav!.url, '--queue', queue, '--out', out, '--json', ...extra], { stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout!.on('data', (c: Buffer) => { stdout += c.toString(); });
    child.stderr!.on('data', (c: Buffer) => { stderr += c.toString(); });
    child.on('exit', (code) => resolve({ status: code ?? -1, stdout, stderr }));
  });
}

const digest = (path: string): string => createHash('sha256').update(readFileSync(path)).digest('hex');

describe.runIf(enabled)('farm (BullMQ on redis-server, shared cache on nginx WebDAV)', () => {
  it('bakes a batch submitted twice at once exactly once per probe, byte-identical to a local bake', async () => {
    redis = await startRedis();
    dav = await startDavServer();
    const names = ['north', 'south', 'east'];
    names.forEach((n, i) => writeFileSync(join(work, `${n}.pfm`), sky(64, 32, i + 1)));
    const batch = join(work, 'batch.json');
    writeFileSync(batch, JSON.stringify(names.map((n) => ({ input: { path: `${n}.pfm` }, size: 16, samples: 'draft' }))));
    const a = startWorker(0, 'q1');
    const b = startWorker(1, 'q1');
    await waitFor(() => [a, b].every((w) => w.log.some((l) => l.includes('ready'))), 20_000);
    const [first, second] = await Promise.all([submit(batch, join(work, 'out1'), 'q1'), submit(batch, join(work, 'out2'), 'q1', ['--events'])]);
    expect(first.status, first.stderr).toBe(0);
    expect(second.status, second.stderr).toBe(0);
    // --events: JSON lines only; per probe one submitted and one completed job event, four artifacts.
    const events = second.stderr.trim().split('\n').map((l) => JSON.parse(l) as { probe: string; type: string; state?: string });
    for (const n of names) {
      const mine = events.filter((e) => e.probe === n);
      expect(mine.filter((e) => e.type === 'job').map((e) => e.state)).toEqual(['submitted', 'completed']);
      expect(mine.filter((e) => e.type === 'artifact')).toHaveLength(4);
    }
    const baked = [...a.log, ...b.log].filter((l) => /baked \w+$/.test(l));
    expect(baked.map((l) => l.split(' ').pop()).sort()).toEqual([...names].sort());
    const local = spawnSync(process.execPath, [cli, 'bake', '--batch', batch, '--out', join(work, 'local'), '--no-cache', '--quiet']);
    expect(local.status).toBe(0);
    for (const n of names) {
      for (const ext of ['specular.ktx2', 'irradiance.ktx2', 'dfg.ktx2']) {
        expect(digest(join(work, 'out1', `${n}.${ext}`)), `${n}.${ext}`).toBe(digest(join(work, 'local', `${n}.${ext}`)));
        expect(digest(join(work, 'out2', `${n}.${ext}`))).toBe(digest(join(work, 'local', `${n}.${ext}`)));
      }
    }
    expect(JSON.parse(first.stdout).artifacts).toHaveLength(names.length * 4);
    for (const w of [a, b]) {
      const exited = new Promise<number>((resolve) => w.child.once('exit', (c) => resolve(c ?? -1)));
      w.child.kill('SIGTERM');
      expect(await exited).toBe(0);
    }
  }, 120_000);

  it('finishes the job of a worker killed with SIGKILL mid-bake on another worker, within the lock duration', async () => {
    writeFileSync(join(work, 'big.pfm'), sky(512, 256, 2));
    const batch = join(work, 'big.json');
    writeFileSync(batch, JSON.stringify([{ input: { path: 'big.pfm' }, size: 256, samples: 'draft' }]));
    const lock = ['--lock-ms', '2000'];
    const a = startWorker(2, 'q2', lock);
    await waitFor(() => a.log.some((l) => l.includes('ready')), 20_000);
    const submitting = submit(batch, join(work, 'out-kill'), 'q2');
    await waitFor(() => a.log.some((l) => l.includes('baking big')), 30_000);
    a.child.kill('SIGKILL');
    const killedAt = Date.now();
    const b = startWorker(3, 'q2', lock);
    const result = await submitting;
    expect(result.status, result.stderr).toBe(0);
    expect(b.log.some((l) => /baked big/.test(l))).toBe(true);
    console.log(`killed worker's job finished ${((Date.now() - killedAt) / 1000).toFixed(1)} s after the kill`);
    const local = spawnSync(process.execPath, [cli, 'bake', '--batch', batch, '--out', join(work, 'local-big'), '--no-cache', '--quiet']);
    expect(local.status).toBe(0);
    for (const ext of ['specular.ktx2', 'irradiance.ktx2']) expect(digest(join(work, 'out-kill', `big.${ext}`))).toBe(digest(join(work, 'local-big', `big.${ext}`)));
    b.child.kill('SIGTERM');
  }, 120_000);

  it('survives a Redis restart between jobs, and a stopped cache server makes submit fail clearly', async () => {
    const batch = join(work, 'one.json');
    writeFileSync(batch, JSON.stringify([{ input: { path: 'north.pfm' }, name: 'again', size: 16, samples: 'draft', rotationDeg: 30 }]));
    const w = startWorker(4, 'q3');
    await waitFor(() => w.log.some((l) => l.includes('ready')), 20_000);
    await redis!.stop();
    await redis!.start();
    const after = await submit(batch, join(work, 'out-restart'), 'q3');
    expect(after.status, after.stderr).toBe(0);
    expect(w.log.some((l) => /baked again/.test(l))).toBe(true);
    await dav!.stop();
    try {
      const down = await submit(batch, join(work, 'out-down'), 'q3');
      expect(down.status).toBe(1);
      expect(down.stderr).toContain('shared cache');
    } finally {
      await dav!.start();
    }
    w.child.kill('SIGTERM');
  }, 120_000);
});
