// The async API with progress reporting and a time budget: AbortSignal.timeout() stops the bake
// cleanly (typed ABORTED error, nothing written) when it runs over.
//   node bake-with-timeout.mjs <input> <out dir> <timeout ms>
import { pathToFileURL } from 'node:url';
import { closeSharedPools, createBaker, LightkilnError } from '@lightkiln/bake';

export async function bakeWithTimeout(recipe, outDir, timeoutMs, log = () => {}) {
  const baker = createBaker({ cache: false });
  const seen = new Set();
  try {
    const result = await baker.bake(recipe, {
      outDir,
      signal: AbortSignal.timeout(timeoutMs),
      onProgress: ({ stage, done, total }) => {
        if (!seen.has(stage)) log(`stage ${stage} started`);
        seen.add(stage);
        if (done === total) log(`stage ${stage}: ${total} units done`);
      },
    });
    return { ok: true, stages: [...seen], artifacts: result.artifacts.map((a) => a.name) };
  } catch (error) {
    if (error instanceof LightkilnError && error.code === 'ABORTED') return { ok: false, aborted: true, stages: [...seen] };
    throw error;
  } finally {
    await baker.close();
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const [input, outDir, timeout = '60000'] = process.argv.slice(2);
  if (!input || !outDir) {
    console.error('usage: node bake-with-timeout.mjs <input> <out dir> [timeout ms]');
    process.exit(2);
  }
  const result = await bakeWithTimeout({ input: { path: input } }, outDir, Number(timeout), (line) => console.error(line));
  console.log(JSON.stringify(result));
  await closeSharedPools();
  process.exitCode = result.ok ? 0 : 1;
}
