/**
 * The farm on real servers (Debian redis-server and nginx WebDAV, started here on free loopback ports and
 * stopped by PID): two `lightkiln farm worker` processes of one thread each on this machine, a batch of
 * eight probes. Prints the cold batch's efficiency against the workers' own bake times, the warm
 * resubmission (new queue, same shared cache: nothing baked) and the queue overhead per job (a resubmission
 * whose jobs are already finished). Skipped, with a message, without the servers.
 */

import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Queue, QueueEvents, Worker } from 'bullmq';
import { Redis } from 'ioredis';
import { encodePfm } from '@lightkiln/codecs';
import { record, syntheticSky } from './common.js';

const cli = fileURLToPath(new URL('../../packages/cli/dist/main.js', import.meta.url));

function has(tool: string): boolean {
  return spawnSync('sh', ['-c', `command -v ${tool}`]).status === 0;
}

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = createServer();
    s.listen(0, '127.0.0.1', () => {
      const a = s.address();
      s.close(() => resolve(typeof a === 'object' && a !== null ? a.port : 0));
    });
  });
}

async function waitUntil(cond: () => boolean, ms: number): Promise<void> {
  const until = Date.now() + ms;
  while (!cond()) {
    if (Date.now() > until) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 25));
  }
}

function run(args: string[]): Promise<{ status: number; stdout: string; ms: number }> {
  const t0 = performance.now();
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [cli, ...args], { stdio: ['ignore', 'pipe', 'ignore'] });
    let stdout = '';
    child.stdout!.on('data', (c: Buffer) => { stdout += c.toString(); });
    child.on('exit', (code) => resolve({ status: code ?? -1, stdout, ms: performance.now() - t0 }));
  });
}

export async function farmBench(): Promise<void> {
  if (!has('redis-server') || !has('nginx')) {
    console.log('  skipped: needs Debian redis-server and nginx (.ci/run installs them)');
    return;
  }
  const dir = mkdtempSync(join(tmpdir(), 'lightkiln-farm-bench-'));
  const children: ChildProcess[] = [];
  try {
    const redisPort = await freePort();
    const redis = spawn('redis-server', ['--port', String(redisPort), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no', '--maxmemory-policy', 'noeviction'], { stdio: 'ignore' });
    children.push(redis);
    const davPort = await freePort();
    mkdirSync(join(dir, 'data'));
    const asRoot = typeof process.getuid === 'function' && process.getuid() === 0;
    writeFileSync(join(dir, 'nginx.conf'), `${asRoot ? 'user root;\n' : ''}daemon off;\nworker_processes 1;\npid ${dir}/nginx.pid;\nerror_log ${dir}/error.log warn;\nevents { worker_connections 64; }\nhttp {\n  access_log off;\n  client_body_temp_path ${dir}/body;\n  server {\n    listen 127.0.0.1:${davPort};\n    root ${dir}/data;\n    client_max_body_size 1g;\n    location / { dav_methods PUT DELETE; create_full_put_path on; }\n  }\n}\n`);
    const nginx = spawn('nginx', ['-c', join(dir, 'nginx.conf'), '-p', dir, '-e', join(dir, 'error.log')], { stdio: 'ignore' });
    children.push(nginx);
    await new Promise((r) => setTimeout(r, 500));
    const redisUrl = `redis://127.0.0.1:${redisPort}`;
    const davUrl = `http://127.0.0.1:${davPort}`;
    const probes = 8;
    const entries = [];
    for (let i = 0; i < probes; i++) {
      const sky = syntheticSky(512, 256);
      for (let k = 0; k < sky.length; k += 3) sky[k] = sky[k]! * (1 + 0.05 * i);
      writeFileSync(join(dir, `p${i}.pfm`), encodePfm({ width: 512, height: 256, channels: 3, data: sky }));
      entries.push({ input: { path: `p${i}.pfm` }, size: 128 });
    }
    writeFileSync(join(dir, 'batch.json'), JSON.stringify(entries));
    const startWorkers = async (queue: string): Promise<ChildProcess[]> => {
      const started = [0, 1].map((w) => {
        const c = spawn(process.execPath, [cli, 'farm', 'worker', '--redis', redisUrl, '--remote-cache', davUrl, '--queue', queue, '--threads', '1', '--cache-dir', join(dir, `cache-${queue}-${w}`)], { stdio: ['ignore', 'ignore', 'pipe'] });
        let ready = false;
        c.stderr!.on('data', (d: Buffer) => { if (d.toString().includes('ready')) ready = true; });
        children.push(c);
        return { c, isReady: () => ready };
      });
      await waitUntil(() => started.every((s) => s.isReady()), 30_000);
      return started.map((s) => s.c);
    };
    const submit = (queue: string, out: string): Promise<{ status: number; stdout: string; ms: number }> =>
      run(['farm', 'submit', '--batch', join(dir, 'batch.json'), '--redis', redisUrl, '--remote-cache', davUrl, '--queue', queue, '--out', join(dir, out), '--json', '--quiet']);
    await startWorkers('cold');
    const cold = await submit('cold', 'out-cold');
    if (cold.status !== 0) throw new Error('cold submission failed');
    const doc = JSON.parse(cold.stdout) as { probes: { ms: number }[] };
    const sumMs = doc.probes.reduce((n, p) => n + p.ms, 0);
    console.log(`\n# farm: ${probes} probes at 128 from 512 x 256, 2 workers of 1 thread on this machine`);
    record('cold batch wall', cold.ms, 'ms', `workers' bake times sum to ${sumMs.toFixed(0)} ms; wall / (sum / 2) = ${(cold.ms / (sumMs / 2)).toFixed(2)} (submit process start included)`);
    const again = await submit('cold', 'out-again');
    record('resubmission of finished jobs', again.ms / probes, 'ms per job', `${again.ms.toFixed(0)} ms for ${probes} jobs, artifacts downloaded, process start included`);
    // Queue overhead alone: jobs whose processor returns at once, one at a time from add to completion.
    {
      const connections = [0, 1, 2].map(() => new Redis(redisUrl, { maxRetriesPerRequest: null }));
      const queue = new Queue('overhead', { connection: connections[0]! });
      const events = new QueueEvents('overhead', { connection: connections[1]! });
      const worker = new Worker('overhead', async () => 'ok', { connection: connections[2]! });
      await events.waitUntilReady();
      await worker.waitUntilReady();
      const n = 50;
      const t0 = performance.now();
      for (let i = 0; i < n; i++) await (await queue.add('noop', { i })).waitUntilFinished(events, 10_000);
      record('queue overhead (add to completion, empty job)', (performance.now() - t0) / n, 'ms per job', `${n} jobs one after another, BullMQ on this machine's redis-server`);
      await worker.close();
      await events.close();
      await queue.close();
      for (const c of connections) c.disconnect();
    }
    await startWorkers('warm');
    const warm = await submit('warm', 'out-warm');
    record('warm shared cache, new jobs', warm.ms, 'ms', `${(warm.ms / cold.ms).toFixed(2)} x the cold batch; every bake served from the shared cache`);
  } finally {
    for (const c of children) if (c.exitCode === null) c.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 300));
    rmSync(dir, { recursive: true, force: true });
  }
}
