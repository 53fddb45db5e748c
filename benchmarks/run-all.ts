/** Runs every benchmark suite (or the ones named on the command line) and writes benchmarks/results/. */

import { writeReport } from './common.js';
import { specularBench } from './specular.bench.js';

const suites: Record<string, () => Promise<void>> = {
  specular: specularBench,
};

const wanted = process.argv.slice(2);
for (const [name, suite] of Object.entries(suites)) {
  if (wanted.length > 0 && !wanted.includes(name)) continue;
  console.log(`\n## ${name}`);
  await suite();
  writeReport(name);
}
