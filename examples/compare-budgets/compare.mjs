// Compare sample budgets of the Monte Carlo estimator ('sampled') with the default deterministic quadrature
// on one probe: time each bake of the specular chain and measure every level's relative RMSE (BT.709
// luminance) against the brute-force reference convolution. A budget is a preset, a number of samples
// per texel, or 'quadrature'.
//   node compare.mjs <input> [size] [budgetA] [budgetB]
import { pathToFileURL } from 'node:url';
import { decodeKtx2 } from '@lightkiln/codecs';
import { closeSharedPools, createBaker } from '@lightkiln/bake';

function relativeRmse(test, ref) {
  let se = 0;
  let sum = 0;
  const n = ref.length / 4;
  for (let t = 0; t < n; t++) {
    const y = 0.2126 * ref[t * 4] + 0.7152 * ref[t * 4 + 1] + 0.0722 * ref[t * 4 + 2];
    const x = 0.2126 * test[t * 4] + 0.7152 * test[t * 4 + 1] + 0.0722 * test[t * 4 + 2];
    se += (x - y) ** 2;
    sum += y;
  }
  return Math.sqrt(se / n) / (sum / n);
}

export async function compareBudgets(input, size, budgets) {
  const baker = createBaker({ cache: false });
  const base = { input, size, dfg: { enabled: false }, output: { specularFormat: 'rgba32f' } };
  try {
    const reference = decodeKtx2((await baker.bake({ ...base, quality: 'reference' })).artifacts[0].bytes);
    const rows = [];
    for (const samples of budgets) {
      const result = await baker.bake(samples === 'quadrature' ? base : { ...base, quality: 'sampled', samples });
      const spec = decodeKtx2(result.artifacts[0].bytes);
      rows.push({
        samples,
        specularMs: result.manifest.timingsMs.specular,
        relativeRmse: spec.levels.map((level, m) => relativeRmse(level.data, reference.levels[m].data)),
      });
    }
    return rows;
  } finally {
    await baker.close();
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const [path, size = '64', a = 'draft', b = 'default'] = process.argv.slice(2);
  if (!path) {
    console.error('usage: node compare.mjs <input> [size] [budgetA] [budgetB]');
    process.exit(2);
  }
  const parse = (s) => (/^\d+$/.test(s) ? Number(s) : s);
  for (const row of await compareBudgets({ path }, Number(size), [parse(a), parse(b)])) {
    console.log(`${String(row.samples).padEnd(8)} ${row.specularMs.toFixed(0).padStart(6)} ms  ${row.relativeRmse.map((e) => `${(e * 100).toFixed(2)}%`).join(' ')}`);
  }
  await closeSharedPools();
}
