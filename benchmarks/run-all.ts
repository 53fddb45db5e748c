/** Runs every benchmark suite (or the ones named on the command line) and writes benchmarks/results/. */

import { writeReport } from './common.js';
import { bakeBench } from './bake.bench.js';
import { codecsBench } from './codecs.bench.js';
import { estimatorsBench } from './estimators.bench.js';
import { farmBench } from './farm.bench.js';
import { kernelsBench } from './kernels.bench.js';
import { sweepBench } from './sweep.bench.js';
import { mathBench } from './math.bench.js';
import { poolBench } from './pool.bench.js';
import { specularBench } from './specular.bench.js';
import { supercompressionBench } from './supercompression.bench.js';

const suites: Record<string, () => Promise<void>> = {
  math: mathBench,
  specular: specularBench,
  estimators: estimatorsBench,
  kernels: kernelsBench,
  pool: poolBench,
  codecs: codecsBench,
  bake: bakeBench,
  sweep: sweepBench,
  supercompression: supercompressionBench,
  farm: farmBench,
};

const wanted = process.argv.slice(2);
for (const [name, suite] of Object.entries(suites)) {
  if (wanted.length > 0 && !wanted.includes(name)) continue;
  console.log(`\n## ${name}`);
  await suite();
  writeReport(name);
}
