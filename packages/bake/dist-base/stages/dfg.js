/** Stage 6: the DFG lookup table (independent of the input, cached once per option set). */
import { sharedFloat32 } from '@lightkiln/pool';
import { jobOptions, kernel } from './context.js';
export function dfgChannelNames(options) {
    if (!options.multiscatter && !options.cloth)
        return ['A', 'B'];
    return ['A', 'B', options.multiscatter ? 'Eavg' : 'unused', options.cloth ? 'cloth' : 'unused'];
}
export async function bakeDfgTable(options, ctx) {
    const names = dfgChannelNames(options);
    const channels = names.length;
    const size = options.size;
    const dst = sharedFloat32(size * size * channels);
    const params = { width: size, height: size, samples: options.samples, channels, multiscatter: options.multiscatter, cloth: options.cloth };
    await ctx.pool.run({
        kernel: kernel('integrateDfgTable'),
        buffers: { dst },
        segments: [{ begin: 0, end: size * size, costPerItem: 2000 + (options.cloth ? options.samples : 0), rowLength: size, label: 'dfg table' }],
        params,
        ...jobOptions(ctx, 'dfg'),
    });
    return { size, channels, data: dst.slice(), channelNames: names };
}
//# sourceMappingURL=dfg.js.map