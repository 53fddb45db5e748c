import { WorkerPool } from '@lightkiln/pool';
import { buildPyramid } from '@lightkiln/bake/kernels';
import { decodeHdr } from '@lightkiln/codecs';
import { readFileSync } from 'node:fs';
const pool = new WorkerPool({ threads: Number(process.env.T ?? 2) });
const ctx = { pool, signal: undefined, onProgress: undefined, targetTileCost: undefined };
const img = decodeHdr(new Uint8Array(readFileSync('out/observatory-dusk.hdr')));
const src = { kind: 'equirect', width: img.width, height: img.height, data: img.data };
for (let i = 0; i < 4; i++) { const t = performance.now(); await buildPyramid(src, 256, 0, ctx); console.log('pyramid', (performance.now() - t).toFixed(0)); }
await pool.close();
