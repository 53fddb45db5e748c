#!/usr/bin/env node
// Long decoder fuzzing: repeats the fuzz suite (packages/codecs/test/fuzz.test.ts) with fresh seeds and
// prints cases per second; a failure prints its seed, rerun with FUZZ_SEED=<seed> FUZZ_RUNS=<runs>.
//   node test/fuzz-long.mjs [rounds] [runsPerFormat]
import { spawnSync } from 'node:child_process';
const rounds = Number(process.argv[2] ?? 10);
const runs = Number(process.argv[3] ?? 20000);
const formats = 8;
for (let r = 0; r < rounds; r++) {
  const seed = (Date.now() ^ (r * 2654435761)) >>> 0;
  const t0 = performance.now();
  const res = spawnSync('npx', ['vitest', 'run', '--config', 'test/vitest.config.ts', 'packages/codecs/test/fuzz.test.ts'], { env: { ...process.env, FUZZ_RUNS: String(runs), FUZZ_SEED: String(seed) }, encoding: 'utf8' });
  const s = (performance.now() - t0) / 1000;
  if (res.status !== 0) {
    console.log(`round ${r}: FAILED with FUZZ_SEED=${seed} FUZZ_RUNS=${runs}\n${res.stdout.split('\n').filter((l) => /Counterexample|Error|×/.test(l)).join('\n')}`);
    process.exitCode = 1;
  } else {
    console.log(`round ${r}: ${formats * runs} cases in ${s.toFixed(1)} s (${Math.round((formats * runs) / s)} cases/s, process start included), seed ${seed}`);
  }
}
