/**
 * One bake in a fresh process, for figures that need a process of their own (peak RSS):
 *   node dist/bake-child.js <equirect width> <face size> <threads>
 * Prints one JSON line: wall time, stage timings and maxRSS.
 */

import { closeSharedPools, createBaker } from '@lightkiln/bake';
import { encodePfm } from '@lightkiln/codecs';
import { syntheticSky } from './common.js';

const width = Number(process.argv[2] ?? 2048);
const size = Number(process.argv[3] ?? 256);
const threads = Number(process.argv[4] ?? 2);
const bytes = encodePfm({ width, height: width / 2, channels: 3, data: syntheticSky(width, width / 2) });
const baker = createBaker({ threads, cache: false });
const t0 = performance.now();
const result = await baker.bake({ input: { bytes, name: 'sky.pfm' }, size });
const wallMs = performance.now() - t0;
await baker.close();
await closeSharedPools();
console.log(JSON.stringify({ width, size, threads, wallMs, timings: result.manifest.timingsMs, maxRssMiB: process.resourceUsage().maxRSS / 1024 }));
