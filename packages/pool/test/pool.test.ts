import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { PoolError, WorkerPool, getSharedPool, closeSharedPools, planTiles, sharedFloat32, sharedInt32, type KernelRef, type JobProgress } from '@lightkiln/pool';

const moduleUrl = new URL('./fixtures/kernels.mjs', import.meta.url).href;
const kernel = (name: string): KernelRef => ({ moduleUrl, name });

const N = 6 * 32 * 32;
function inputs(): { src: Float32Array; dst: Float32Array } {
  const src = sharedFloat32(N);
  for (let i = 0; i < N; i++) src[i] = Math.sin(i * 0.37);
  return { src, dst: sharedFloat32(N) };
}
const faceSegments = Array.from({ length: 6 }, (_, f) => ({ begin: f * 1024, end: (f + 1) * 1024, costPerItem: 50, rowLength: 32, label: `face ${f}` }));
const hash = (a: Float32Array): string => createHash('sha256').update(new Uint8Array(a.buffer.slice(0))).digest('hex');

const pools: WorkerPool[] = [];
function pool(threads: number): WorkerPool {
  const p = new WorkerPool({ threads });
  pools.push(p);
  return p;
}
afterAll(async () => {
  await Promise.all(pools.map((p) => p.close()));
  await closeSharedPools();
});

describe('tile planning', () => {
  it('covers every item once, aligned to rows, heaviest first', () => {
    const tiles = planTiles([{ begin: 0, end: 100, costPerItem: 1, rowLength: 10 }, { begin: 100, end: 130, costPerItem: 10, rowLength: 10 }], { targetCost: 35 });
    const seen = new Uint8Array(130);
    for (const t of tiles) {
      expect((t.begin % 10) + (t.end % 10)).toBe(0);
      for (let i = t.begin; i < t.end; i++) seen[i]!++;
    }
    expect([...seen].every((v) => v === 1)).toBe(true);
    for (let i = 1; i < tiles.length; i++) expect(tiles[i - 1]!.cost).toBeGreaterThanOrEqual(tiles[i]!.cost);
  });
});

describe('determinism', () => {
  it('gives bit-identical outputs over threads 0/1/2/4 and three tile sizes', async () => {
    const hashes = new Set<string>();
    for (const threads of [0, 1, 2, 4]) {
      const p = pool(threads);
      for (const targetTileCost of [1600, 20_000, 1_000_000]) {
        const buffers = inputs();
        await p.run({ kernel: kernel('mix'), buffers, segments: faceSegments, params: { work: 20 }, targetTileCost });
        hashes.add(hash(buffers.dst));
      }
    }
    expect(hashes.size).toBe(1);
  });
});

describe('progress', () => {
  it('reports monotonic totals that add up, for threaded and inline runs', async () => {
    for (const threads of [0, 2]) {
      const events: JobProgress[] = [];
      await pool(threads).run({ kernel: kernel('mix'), buffers: inputs(), segments: faceSegments, params: { work: 5 }, targetTileCost: 3200, progressIntervalMs: 0, onProgress: (e) => events.push(e) });
      const last = events.at(-1)!;
      expect(last.done).toBe(N * 50);
      expect(last.total).toBe(N * 50);
      expect(last.tilesDone).toBe(last.tilesTotal);
      for (let i = 1; i < events.length; i++) expect(events[i]!.done).toBeGreaterThanOrEqual(events[i - 1]!.done);
    }
  });
});

describe('cancellation', () => {
  it('rejects at once when aborted before the job starts, running nothing', async () => {
    const controller = new AbortController();
    controller.abort();
    const counter = sharedInt32(1);
    const gate = sharedInt32(1);
    gate[0] = 1;
    const run = pool(2).run({ kernel: kernel('gated'), buffers: { ...inputs(), counter, gate }, segments: faceSegments, signal: controller.signal });
    await expect(run).rejects.toMatchObject({ code: 'ABORTED' });
    expect(counter[0]).toBe(0);
  });

  it('stops scheduling and rejects when aborted during a job', async () => {
    const controller = new AbortController();
    const counter = sharedInt32(1);
    const gate = sharedInt32(1);
    const p = pool(2);
    const run = p.run({ kernel: kernel('gated'), buffers: { ...inputs(), counter, gate }, segments: faceSegments, targetTileCost: 1600, signal: controller.signal });
    const rejection = expect(run).rejects.toMatchObject({ code: 'ABORTED' });
    // Wait (without sleeping) until a worker is inside the kernel.
    while (Atomics.load(counter, 0) === 0) await Atomics.waitAsync(counter, 0, 0).value;
    controller.abort();
    await rejection;
    Atomics.store(gate, 0, 1);
    Atomics.notify(gate, 0);
    const started = Atomics.load(counter, 0);
    expect(started).toBeLessThan(planTiles(faceSegments, { targetCost: 1600 }).length);
    // The pool keeps serving.
    await expect(p.run({ kernel: kernel('mix'), buffers: inputs(), segments: faceSegments, params: { work: 1 } })).resolves.toMatchObject({ tiles: expect.any(Number) });
  });
});

describe('failures', () => {
  it('rejects with the kernel name, the tile and the message when a kernel throws; the pool keeps serving', async () => {
    for (const threads of [0, 2]) {
      const p = pool(threads);
      const error = await p.run({ kernel: kernel('throwOn'), buffers: inputs(), segments: faceSegments, params: { badItem: 2100 } }).catch((e: unknown) => e);
      expect(error).toBeInstanceOf(PoolError);
      expect((error as PoolError).code).toBe('KERNEL_FAILED');
      expect((error as PoolError).message).toContain('throwOn');
      expect((error as PoolError).message).toContain('face 2');
      expect((error as PoolError).message).toContain('bad item 2100');
      expect((error as PoolError).tile?.segment).toBe(2);
      await expect(p.run({ kernel: kernel('mix'), buffers: inputs(), segments: faceSegments, params: { work: 1 } })).resolves.toBeTruthy();
    }
  });

  it('rejects when a worker calls process.exit, replaces it, and serves other jobs', async () => {
    const p = pool(2);
    const error = await p.run({ kernel: kernel('exitOn'), buffers: inputs(), segments: faceSegments, params: { badItem: 10 } }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(PoolError);
    expect(['WORKER_DIED', 'KERNEL_FAILED']).toContain((error as PoolError).code);
    expect((error as PoolError).message).toContain('exitOn');
    const buffers = inputs();
    await p.run({ kernel: kernel('mix'), buffers, segments: faceSegments, params: { work: 3 } });
    const reference = inputs();
    await pool(0).run({ kernel: kernel('mix'), buffers: reference, segments: faceSegments, params: { work: 3 } });
    expect(hash(buffers.dst)).toBe(hash(reference.dst));
  });

  it('names a missing kernel', async () => {
    await expect(pool(0).run({ kernel: kernel('nope'), buffers: inputs(), segments: faceSegments })).rejects.toMatchObject({ code: 'KERNEL_NOT_FOUND' });
    await expect(pool(1).run({ kernel: kernel('nope'), buffers: inputs(), segments: faceSegments })).rejects.toThrow(/nope/);
  });

  it('refuses non-shared buffers and bad options with messages naming the field', async () => {
    await expect(pool(1).run({ kernel: kernel('mix'), buffers: { src: new Float32Array(4), dst: sharedFloat32(4) }, segments: [] })).rejects.toThrow(/buffer "src" is not backed by a SharedArrayBuffer/);
    expect(() => new WorkerPool({ threads: -1 })).toThrow(/threads must be an integer in 0..256/);
    expect(() => new WorkerPool({ threads: 1.5 })).toThrow(/threads/);
  });
});

describe('concurrency', () => {
  it('runs many concurrent jobs correctly and lets a small job finish before a large one', async () => {
    const p = getSharedPool({ threads: 2 });
    expect(getSharedPool({ threads: 2 })).toBe(p);
    const reference = inputs();
    await pool(0).run({ kernel: kernel('mix'), buffers: reference, segments: faceSegments, params: { work: 4 } });
    const expected = hash(reference.dst);
    const jobs = Array.from({ length: 16 }, () => {
      const buffers = inputs();
      return p.run({ kernel: kernel('mix'), buffers, segments: faceSegments, params: { work: 4 }, targetTileCost: 6400 }).then(() => hash(buffers.dst));
    });
    expect(new Set(await Promise.all(jobs))).toEqual(new Set([expected]));

    const order: string[] = [];
    const big = p.run({ kernel: kernel('mix'), buffers: inputs(), segments: faceSegments, params: { work: 200 }, targetTileCost: 3200 }).then(() => order.push('big'));
    const small = p.run({ kernel: kernel('mix'), buffers: inputs(), segments: faceSegments.slice(0, 1), params: { work: 1 }, targetTileCost: 3200 }).then(() => order.push('small'));
    await Promise.all([big, small]);
    expect(order).toEqual(['small', 'big']);
  });

  it('runs a foreground job ahead of a background job submitted before it, with the same results', async () => {
    const p = new WorkerPool({ threads: 2 });
    const clock = sharedInt32(1);
    const back = { clock, order: sharedInt32(64) };
    const front = { clock, order: sharedInt32(64) };
    const segments = [{ begin: 0, end: 64, costPerItem: 1 }];
    // Both workers up first: a tile handed to a worker that is still starting waits there while the
    // other worker runs what comes after it.
    await p.run({ kernel: kernel('stamp'), buffers: { clock: sharedInt32(1), order: sharedInt32(8) }, segments: [{ begin: 0, end: 8, costPerItem: 1 }], targetTileCost: 1 });
    // One item per tile: the background job has 64 tiles queued when the foreground job arrives.
    const b = p.run({ kernel: kernel('stamp'), buffers: back, segments, targetTileCost: 1, priority: 'background' });
    const f = p.run({ kernel: kernel('stamp'), buffers: front, segments, targetTileCost: 1 });
    await Promise.all([b, f]);
    // At most two background tiles per worker were handed out before the foreground job came (the one a
    // worker runs and the next in its queue), so they are all that can run before the foreground's median
    // tile (the median, not the last: one tile held up by a descheduled worker must not decide). Ignoring
    // priorities, 32 or more run before it.
    const medianFront = [...front.order].sort((x, y) => x - y)[32]!;
    const backBefore = [...back.order].filter((t) => t < medianFront).length;
    expect(backBefore).toBeLessThanOrEqual(4);
    expect(new Set([...front.order, ...back.order]).size).toBe(128);
    const mixed = inputs();
    const plain = inputs();
    await Promise.all([
      p.run({ kernel: kernel('mix'), buffers: mixed, segments: faceSegments, params: { work: 4 }, targetTileCost: 6400, priority: 'background' }),
      p.run({ kernel: kernel('mix'), buffers: plain, segments: faceSegments, params: { work: 4 }, targetTileCost: 6400 }),
    ]);
    expect(hash(mixed.dst)).toBe(hash(plain.dst));
    await p.close();
  });

  it('rejects a job still waiting for a worker when the pool closes', async () => {
    const p = new WorkerPool({ threads: 1 });
    const counter = sharedInt32(1);
    const gate = sharedInt32(1);
    const busy = p.run({ kernel: kernel('gated'), buffers: { ...inputs(), counter, gate }, segments: faceSegments, targetTileCost: 1600 });
    const waiting = p.run({ kernel: kernel('mix'), buffers: inputs(), segments: faceSegments, params: { work: 1 }, priority: 'background' });
    const rejections = Promise.all([expect(busy).rejects.toMatchObject({ code: 'POOL_CLOSED' }), expect(waiting).rejects.toMatchObject({ code: 'POOL_CLOSED' })]);
    while (Atomics.load(counter, 0) === 0) await Atomics.waitAsync(counter, 0, 0).value;
    const closing = p.close();
    Atomics.store(gate, 0, 1);
    Atomics.notify(gate, 0);
    await closing;
    await rejections;
  });

  it('rejects jobs in flight with POOL_CLOSED when the pool closes, and refuses new ones', async () => {
    const p = new WorkerPool({ threads: 2 });
    const counter = sharedInt32(1);
    const gate = sharedInt32(1);
    const run = p.run({ kernel: kernel('gated'), buffers: { ...inputs(), counter, gate }, segments: faceSegments, targetTileCost: 1600 });
    const rejection = expect(run).rejects.toMatchObject({ code: 'POOL_CLOSED' });
    while (Atomics.load(counter, 0) === 0) await Atomics.waitAsync(counter, 0, 0).value;
    const closing = p.close();
    Atomics.store(gate, 0, 1);
    Atomics.notify(gate, 0);
    await closing;
    await rejection;
    await expect(p.run({ kernel: kernel('mix'), buffers: inputs(), segments: faceSegments })).rejects.toMatchObject({ code: 'POOL_CLOSED' });
    await p.close();
  });
});

describe('node flags of the parent process', () => {
  // Node refuses V8 and process-wide options in a worker's execArgv (ERR_WORKER_INVALID_EXEC_ARGV); a
  // pool started under `node --max-old-space-size=...` (common practice for big bakes) must still run.
  const script = `
    const { WorkerPool, sharedFloat32 } = await import(${JSON.stringify(new URL('../dist/index.js', import.meta.url).href)});
    const pool = new WorkerPool({ threads: 2 });
    const src = sharedFloat32(64).fill(1);
    const dst = sharedFloat32(64);
    await pool.run({ kernel: { moduleUrl: ${JSON.stringify(moduleUrl)}, name: 'mix' }, buffers: { src, dst }, params: { work: 1 }, segments: [{ begin: 0, end: 64, costPerItem: 1, rowLength: 8 }], targetTileCost: 8 });
    await pool.close();
    console.log(dst.every((v) => v !== 0) ? 'ran' : 'empty');
  `;
  for (const flags of [['--max-old-space-size=2048', '--stack-size=900'], ['--conditions=source', '--max-old-space-size=2048', '--no-warnings', '--enable-source-maps']]) {
    it(`runs jobs under ${flags.join(' ')}`, () => {
      const r = spawnSync(process.execPath, [...flags, '--input-type=module', '-e', script], { encoding: 'utf8', timeout: 60_000 });
      expect(r.stderr).toBe('');
      expect(r.stdout.trim()).toBe('ran');
    });
  }
});

