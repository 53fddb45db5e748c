/** Stage 6: the DFG lookup table (independent of the input, cached once per option set). */

import { sharedFloat32 } from '@lightkiln/pool';
import type { DfgParams } from '../kernels/dfg.js';
import { jobOptions, kernel, type StageContext } from './context.js';

export interface DfgOptions {
  readonly size: number;
  readonly samples: number;
  readonly multiscatter: boolean;
  readonly cloth: boolean;
}

export interface DfgTable {
  readonly size: number;
  /** 2 (A, B) or 4 (A, B, E_avg or 0, cloth or 0). */
  readonly channels: number;
  readonly data: Float32Array;
  /** Names of the channels, in order, for the file's metadata. */
  readonly channelNames: readonly string[];
}

export function dfgChannelNames(options: DfgOptions): string[] {
  if (!options.multiscatter && !options.cloth) return ['A', 'B'];
  return ['A', 'B', options.multiscatter ? 'Eavg' : 'unused', options.cloth ? 'cloth' : 'unused'];
}

export async function bakeDfgTable(options: DfgOptions, ctx: StageContext): Promise<DfgTable> {
  const names = dfgChannelNames(options);
  const channels = names.length;
  const size = options.size;
  const dst = sharedFloat32(size * size * channels);
  const params: DfgParams = { width: size, height: size, samples: options.samples, channels, multiscatter: options.multiscatter, cloth: options.cloth };
  await ctx.pool.run({
    kernel: kernel('integrateDfgTable'),
    buffers: { dst },
    segments: [{ begin: 0, end: size * size, costPerItem: 2000 + (options.cloth ? options.samples : 0), rowLength: size, label: 'dfg table' }],
    params,
    ...jobOptions(ctx, 'dfg'),
  });
  return { size, channels, data: dst.slice(), channelNames: names };
}
