/**
 * One bake in a fresh process, for figures that need a process of their own (peak RSS):
 *   node dist/bake-child.js <equirect width> <face size> <threads> [repeats]
 * Prints one JSON line: wall time and stage timings of the first bake, the median specular-stage time and
 * whole-bake time over the repeats (a warm library baker: JIT and workers warmed by the first), and maxRSS.
 */

import { closeSharedPools, createBaker } from '@lightkiln/bake';
import { encodePfm } from '@lightkiln/codecs';
import { syntheticSky } from './common.js';

const width = Number(process.argv[2] ?? 2048);
const size = Number(process.argv[3] ?? 256);
const threads = Number(process.argv[4] ?? 2);
const repeats = Number(process.argv[5] ?? 1);
const bytes = encodePfm({ width, height: width / 2, channels: 3, data: syntheticSky(width, width / 2) });
const baker = createBaker({ threads, cache: false });
const t0 = performance.now();
const result = await baker.bake({ input: { bytes, name: 'sky.pfm' }, size });
const wallMs = performance.now() - t0;
const specular: number[] = [];
const warm: number[] = [];
for (let i = 1; i < repeats; i++) {
  const t = performance.now();
  specular.push((await baker.bake({ input: { bytes, name: 'sky.pfm' }, size })).manifest.timingsMs.specular!);
  warm.push(performance.now() - t);
}
specular.sort((a, b) => a - b);
warm.sort((a, b) => a - b);
const specularMedianMs = specular.length > 0 ? specular[specular.length >> 1]! : result.manifest.timingsMs.specular!;
const warmMedianMs = warm.length > 0 ? warm[warm.length >> 1]! : wallMs;
await baker.close();
await closeSharedPools();
console.log(JSON.stringify({ width, size, threads, wallMs, timings: result.manifest.timingsMs, specularMedianMs, warmMedianMs, maxRssMiB: process.resourceUsage().maxRSS / 1024 }));
