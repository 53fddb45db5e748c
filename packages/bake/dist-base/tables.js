/**
 * The bake as data: one table of stages (the cached intermediates, each with the stages it reads) and one
 * table of artifacts (the files a bake returns, each with its key, name, format, the stages it needs and
 * how it is built). Baker.bake builds the artifact rows, Baker.plan walks both tables, and the cache
 * events take their labels from them: adding an artifact or a stage is a row here (and its builder).
 */
import { decodeKtx2, encodeExr, encodeHdr } from '@lightkiln/codecs';
import { renderContactSheet } from './preview/sheet.js';
import { levelDescriptors, roughnessToLodFormula } from './recipe.js';
import { encodeTimed } from './run.js';
import { cubeCross, encodeCubeKtx2, encodeDfgKtx2 } from './stages/encode.js';
export function stageRows(keys) {
    return [
        { name: 'source', key: keys.source, inputs: [] },
        { name: 'pyramid', key: keys.pyramid, inputs: ['source'] },
        ...keys.levels.map((key, m) => ({ name: `level ${m}`, key, inputs: ['pyramid'] })),
        { name: 'sh', key: keys.sh, inputs: ['pyramid'] },
        { name: 'irradiance cube', key: keys.irradianceCube, inputs: ['pyramid', 'sh'] },
        { name: 'dfg', key: keys.dfg, inputs: [] },
    ];
}
export function artifactRows(r, keys) {
    const levelStages = keys.levels.map((_, m) => `level ${m}`);
    const rows = [
        {
            kind: 'specular', name: `${r.name}.specular.ktx2`, key: keys.specularFile, label: 'specular file', phase: 1, stages: levelStages,
            format: () => `ktx2/${r.output.specularFormat}`,
            build: async (run) => {
                const levels = await run.levels();
                const { sanitized } = await run.pyramid();
                const { bytes, clamped } = await encodeTimed(run, () => encodeCubeKtx2(levels.map((l) => l.data), r.size, r.output.specularFormat, r.output.supercompression, {
                    'lightkiln.content': 'prefiltered radiance (GGX, split sum, n = v = r)',
                    'lightkiln.roughness': JSON.stringify(r.roughness),
                    'lightkiln.roughnessToLod': roughnessToLodFormula(r.roughness),
                    'lightkiln.samples': JSON.stringify(r.samples),
                }));
                const descriptors = levelDescriptors(r);
                const meta = {
                    sanitized,
                    clamped,
                    levels: levels.map((l) => {
                        const d = descriptors[l.level];
                        return { level: d.level, size: d.faceSize, roughness: d.perceptualRoughness, samples: d.requestedSamples, usedSamples: d.level === 0 ? 0 : l.usedSamples, relativeErrorEstimate: l.relativeErrorEstimate };
                    }),
                };
                return { bytes, meta };
            },
        },
        {
            kind: 'irradiance', name: `${r.name}.irradiance.ktx2`, key: keys.irradianceFile, label: 'irradiance file', phase: 1, stages: ['sh', 'irradiance cube'],
            format: () => `ktx2/${r.output.irradianceFormat}`,
            build: async (run) => {
                const sh = await run.sh();
                const cube = await run.irradianceCube();
                const { bytes, clamped } = await encodeTimed(run, () => encodeCubeKtx2([cube], r.irradiance.cubeSize, r.output.irradianceFormat, r.output.supercompression, {
                    'lightkiln.content': 'irradiance E(n) (not E / pi)',
                    'lightkiln.source': r.irradiance.cubeSource,
                }));
                const meta = { radiance: [...sh.radiance], irradiance: [...sh.irradiance], clamped };
                return { bytes, meta };
            },
        },
    ];
    if (r.dfg.enabled)
        rows.push(lutRow(r, keys.lutFile));
    for (const view of keys.views) {
        rows.push({
            kind: 'view', name: view.name, key: view.key, label: `view ${view.name}`, phase: 2, stages: view.kind === 'mirror' ? ['level 0'] : ['irradiance cube'],
            format: () => view.format,
            build: async (run) => {
                const data = view.kind === 'mirror' ? (await run.levels())[0].data : await run.irradianceCube();
                const image = cubeCross(data, view.kind === 'mirror' ? r.size : r.irradiance.cubeSize);
                return { bytes: view.format === 'hdr' ? encodeHdr(image) : encodeExr(image, { pixelType: 'half', compression: 'zip' }), meta: {} };
            },
        });
    }
    if (r.output.preview) {
        rows.push({
            kind: 'preview', name: `${r.name}.preview.png`, key: keys.preview, label: 'preview', phase: 2,
            stages: [...levelStages, 'sh', 'irradiance cube', ...(r.dfg.enabled ? ['dfg'] : [])],
            format: () => 'png',
            build: async (_run, built) => ({
                bytes: renderContactSheet({
                    probe: r.name, roughness: r.roughness,
                    specular: decodeKtx2(built.specular.bytes), irradiance: decodeKtx2(built.irradiance.bytes),
                    lut: built.lut === undefined ? null : decodeKtx2(built.lut.bytes),
                }),
                meta: {},
            }),
        });
    }
    return rows;
}
/** The DFG table's file: it needs no input, so a bake may start it before the input is read. */
export function lutRow(r, lutFile) {
    return {
        kind: 'lut', name: `${r.name}.dfg.ktx2`, key: lutFile, label: 'lut file', phase: 1, stages: ['dfg'],
        format: (meta) => (meta.channels.length === 2 ? 'ktx2/rg16f' : 'ktx2/rgba16f'),
        build: async (run) => {
            const table = await run.dfg();
            const meta = { channels: [...table.channelNames] };
            return { bytes: await encodeTimed(run, () => encodeDfgKtx2(table, r.output.supercompression, r.dfg.samples)), meta };
        },
    };
}
/** Cache-event labels of every key of a bake. */
export function keyLabels(recipe, keys) {
    const labels = new Map();
    for (const s of stageRows(keys))
        labels.set(s.key, s.name);
    for (const a of artifactRows(recipe, keys))
        labels.set(a.key, a.label);
    return labels;
}
/**
 * What a bake would read and compute, given which keys are cached: every missing artifact needs its
 * stages; a needed stage that is not cached is computed and needs its inputs in turn.
 */
export function planFromTables(recipe, keys, cached) {
    const stages = stageRows(keys);
    const byName = new Map(stages.map((s) => [s.name, s]));
    const needed = new Set();
    const need = (name) => {
        if (needed.has(name))
            return;
        needed.add(name);
        const stage = byName.get(name);
        if (!cached(stage.key))
            for (const input of stage.inputs)
                need(input);
    };
    const artifacts = artifactRows(recipe, keys).map((a) => {
        const isCached = cached(a.key);
        if (!isCached)
            for (const s of a.stages)
                need(s);
        return { kind: a.kind, name: a.name, key: a.key, cached: isCached, willCompute: !isCached };
    });
    return {
        artifacts,
        stages: stages.map((s) => ({ kind: s.name, key: s.key, cached: cached(s.key), willCompute: needed.has(s.name) && !cached(s.key) })),
    };
}
//# sourceMappingURL=tables.js.map