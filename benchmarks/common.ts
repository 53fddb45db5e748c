/** Shared benchmark helpers: synthetic inputs, tinybench runs, and the report written to results/. */

import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Bench } from 'tinybench';

export interface Figure {
  readonly name: string;
  readonly value: number;
  readonly unit: string;
  readonly note?: string;
}

const figures: Figure[] = [];

export function record(name: string, value: number, unit: string, note?: string): void {
  figures.push({ name, value, unit, ...(note === undefined ? {} : { note }) });
  console.log(`  ${name}: ${value.toPrecision(4)} ${unit}${note ? ` (${note})` : ''}`);
}

/** Runs a tinybench suite, prints its table and returns the median milliseconds of each task. */
export async function runBench(title: string, tasks: Record<string, () => unknown>, options: { iterations?: number; time?: number; warmup?: boolean } = {}): Promise<Record<string, { medianMs: number; rmePct: number; samples: number }>> {
  const bench = new Bench({ iterations: options.iterations ?? 5, time: options.time ?? 0, warmupIterations: 1, warmupTime: 0, warmup: options.warmup ?? true });
  for (const [name, fn] of Object.entries(tasks)) bench.add(name, fn);
  console.log(`\n# ${title}`);
  await bench.run();
  console.table(bench.table());
  const out: Record<string, { medianMs: number; rmePct: number; samples: number }> = {};
  for (const task of bench.tasks) {
    const r = task.result as unknown as { latency?: { p50?: number; rme?: number; samplesCount?: number }; state?: string; error?: unknown };
    if (r?.latency?.p50 === undefined) throw new Error(`benchmark ${task.name} failed: ${String(r?.error ?? r?.state)}`);
    out[task.name] = { medianMs: r.latency.p50, rmePct: r.latency.rme ?? 0, samples: r.latency.samplesCount ?? 0 };
  }
  return out;
}

export function writeReport(name: string): void {
  const dir = fileURLToPath(new URL('../results/', import.meta.url));
  mkdirSync(dir, { recursive: true });
  writeFileSync(`${dir}${name}.json`, `${JSON.stringify({ date: new Date().toISOString(), node: process.version, figures }, null, 2)}\n`);
  const md = [`# ${name}`, '', '| figure | value | unit | note |', '| --- | --- | --- | --- |', ...figures.map((f) => `| ${f.name} | ${f.value.toPrecision(4)} | ${f.unit} | ${f.note ?? ''} |`)].join('\n');
  writeFileSync(`${dir}${name}.md`, `${md}\n`);
  figures.length = 0;
}

/** A deterministic equirect sky with a small very bright sun (RGB float32). */
export function syntheticSky(width: number, height: number): Float32Array {
  const data = new Float32Array(width * height * 3);
  for (let j = 0; j < height; j++) {
    const v = (j + 0.5) / height;
    for (let i = 0; i < width; i++) {
      const o = (j * width + i) * 3;
      const u = (i + 0.5) / width;
      data[o] = 0.2 + Math.pow(v, 3) * 2 + 0.1 * Math.sin(u * 40);
      data[o + 1] = 0.3 + v;
      data[o + 2] = 1.2 - 0.8 * v;
      const du = u - 0.3;
      const dv = v - 0.45;
      if (du * du + dv * dv < 1e-5) { data[o] = 40000; data[o + 1] = 30000; data[o + 2] = 20000; }
    }
  }
  return data;
}
