/**
 * KTX 2.0 supercompression of the demo's specular cube (observatory-dusk at 256, RGBA16F, default chain):
 * size and encode time of zlib (fflate, scheme 3) against two Zstandard encoders from the registry
 * (@bokuweb/zstd-wasm, the one the codecs use, and zstd-codec), one frame per level as the files hold.
 */

import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import * as zstdWasm from '@bokuweb/zstd-wasm';
import { zlibSync } from 'fflate';
import { closeSharedPools, createBaker } from '@lightkiln/bake';
import { record, runBench } from './common.js';

type Simple = { compress(data: Uint8Array, level: number): Uint8Array };

async function zstdCodecSimple(): Promise<Simple> {
  const require = createRequire(import.meta.url);
  const { ZstdCodec } = require('zstd-codec') as { ZstdCodec: { run(cb: (z: { Simple: new () => Simple }) => void): void } };
  return new Promise((resolve) => ZstdCodec.run((z) => resolve(new z.Simple())));
}

function levelPayloads(bytes: Uint8Array): Uint8Array[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const count = view.getUint32(40, true);
  return Array.from({ length: count }, (_, l) => {
    const offset = Number(view.getBigUint64(80 + l * 24, true));
    return bytes.subarray(offset, offset + Number(view.getBigUint64(88 + l * 24, true)));
  });
}

export async function supercompressionBench(): Promise<void> {
  const sky = 'out/observatory-dusk.hdr';
  if (!existsSync(sky)) execFileSync(process.execPath, ['examples/observatory-dusk/make-sky.mjs', sky], { stdio: 'inherit' });
  const baker = createBaker({ threads: 2, cache: false });
  const result = await baker.bake({ input: { path: sky }, size: 256, dfg: { enabled: false } });
  await baker.close();
  await closeSharedPools();
  const levels = levelPayloads(result.artifacts.find((a) => a.kind === 'specular')!.bytes);
  const raw = levels.reduce((n, l) => n + l.length, 0);
  const wasm = ((zstdWasm as unknown as { default?: typeof zstdWasm }).default ?? zstdWasm);
  await wasm.init();
  const codec = await zstdCodecSimple();
  const encoders: Record<string, (data: Uint8Array) => Uint8Array> = {
    'zlib 6 (fflate)': (d) => zlibSync(d, { level: 6 }),
    'zstd 3 (zstd-wasm, our default)': (d) => wasm.compress(d, 3),
    'zstd 9 (zstd-wasm)': (d) => wasm.compress(d, 9),
    'zstd 19 (zstd-wasm)': (d) => wasm.compress(d, 19),
    'zstd 3 (zstd-codec)': (d) => codec.compress(d, 3),
    'zstd 9 (zstd-codec)': (d) => codec.compress(d, 9),
  };
  console.log(`\n# supercompression of the demo's specular cube (256, rgba16f, ${(raw / 1e6).toFixed(2)} MB raw, ${levels.length} levels)`);
  for (const [name, fn] of Object.entries(encoders)) {
    try {
      const times = await runBench(name, { [name]: () => levels.map(fn) }, { iterations: 5 });
      const size = levels.reduce((n, l) => n + fn(l).length, 0);
      record(`${name} size`, size / 1e6, 'MB', `${((100 * size) / raw).toFixed(1)}% of raw, ${times[name]!.medianMs.toFixed(1)} ms`);
    } catch (error) {
      // zstd-codec is asm.js with a fixed heap: large levels at higher levels abort with OOM.
      console.log(`  ${name}: failed (${error instanceof Error ? error.message.split('\n')[0] : String(error)})`);
    }
  }
}
