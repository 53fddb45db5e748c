// An asset-cooker integration: bake every environment in a folder, incrementally. `plan` tells the build
// which probes changed (and which stages will run) before any work; the content-hash cache makes the
// unchanged ones cost a hash and a copy from the cache into the output folder.
//   node cook.mjs <folder with .hdr/.exr/.pfm> <out dir> [cache dir]
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { closeSharedPools, createBaker } from '@lightkiln/bake';

export async function cook(folder, outDir, cacheDir, recipeFields = {}) {
  const baker = createBaker({ cache: cacheDir });
  const report = [];
  try {
    const inputs = readdirSync(folder).filter((f) => /\.(hdr|exr|pfm)$/i.test(f)).sort();
    for (const file of inputs) {
      const recipe = { input: { path: join(folder, file) }, ...recipeFields };
      const plan = await baker.plan(recipe);
      const recomputed = plan.stages.filter((s) => s.willCompute).map((s) => s.kind);
      const started = performance.now();
      // Even an up-to-date probe is "baked": its files come from the cache and land in outDir.
      await baker.bake(recipe, { outDir });
      report.push({ probe: plan.probe, action: plan.upToDate ? 'from cache' : 'baked', recomputed, ms: Math.round(performance.now() - started) });
    }
  } finally {
    await baker.close();
  }
  return report;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const [folder, outDir, cacheDir = '.lightkiln-cache'] = process.argv.slice(2);
  if (!folder || !outDir) {
    console.error('usage: node cook.mjs <folder> <out dir> [cache dir]');
    process.exit(2);
  }
  for (const line of await cook(folder, outDir, cacheDir)) console.log(JSON.stringify(line));
  await closeSharedPools();
}
