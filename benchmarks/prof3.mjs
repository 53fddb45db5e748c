import { WorkerPool } from '@lightkiln/pool';
import { buildPyramid, prefilterLevels } from '@lightkiln/bake/kernels';
import { decodeHdr } from '@lightkiln/codecs';
import { readFileSync } from 'node:fs';
const pool = new WorkerPool({ threads: 0 });
const ctx = { pool, signal: undefined, onProgress: undefined, targetTileCost: undefined };
const img = decodeHdr(new Uint8Array(readFileSync('out/observatory-dusk.hdr')));
const src = { kind: 'equirect', width: img.width, height: img.height, data: img.data };
const size = 256;
const pyr = await buildPyramid(src, size, 0, ctx);
const L = Math.log2(size) + 1;
const req = Array.from({ length: L - 1 }, (_, i) => ({ level: i + 1, size: size >> (i + 1), roughness: (i + 1) / (L - 1), samples: Math.round((256 + 768 * (i + 1) / (L - 1)) / 8) * 8 }));
const opts = { filtered: true, lodBias: 0.5, clampLuminance: 0, rotateSequence: false };
for (let i = 0; i < 2; i++) {
  let t = performance.now(); await prefilterLevels(pyr, req, { ...opts, quality: 'quadrature' }, ctx); const a = performance.now() - t;
  t = performance.now(); await prefilterLevels(pyr, req, { ...opts, quality: 'sampled' }, ctx); const b = performance.now() - t;
  console.log(`quadrature ${a.toFixed(0)} ms, filtered ${b.toFixed(0)} ms`);
}
