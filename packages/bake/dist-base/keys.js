/**
 * Cache keys of a bake: every stage and every file has a key, the SHA-256 of its name, its algorithm
 * version and exactly the inputs it depends on (hash.ts), so a changed option recomputes only what
 * depends on it.
 */
import { stageKey } from './hash.js';
import { STAGE_VERSIONS } from './version.js';
import { levelDescriptors } from './recipe.js';
export { STAGE_VERSIONS } from './version.js';
/** Keys of the DFG table and its file: they depend on the table's options only (no input). */
export function lutKeys(options, supercompression) {
    const dfg = stageKey('dfg', STAGE_VERSIONS.dfg, { size: options.size, samples: options.samples, multiscatter: options.multiscatter, cloth: options.cloth });
    return { dfg, lutFile: stageKey('lutFile', STAGE_VERSIONS.lutFile, { dfg, supercompression }) };
}
export function computeKeys(recipe, inputHash) {
    const V = STAGE_VERSIONS;
    const source = stageKey('source', V.source, { inputHash, layout: recipe.input.layout, sanitize: recipe.sanitize });
    // The pyramid's base size follows from the recipe and the source (pyramidBaseSize), both in this key.
    const pyramid = stageKey('pyramid', V.pyramid, { source, size: recipe.size, roughness: recipe.roughness, quality: recipe.quality === 'reference' ? 'reference' : 'default', rotationDeg: recipe.rotationDeg });
    const levels = levelDescriptors(recipe).map((d) => stageKey('level', V.level, {
        pyramid, level: d.level, size: d.faceSize, roughness: d.perceptualRoughness, samples: d.requestedSamples,
        filtered: recipe.filtered, lodBias: recipe.lodBias, clampLuminance: recipe.clampLuminance, rotateSequence: recipe.rotateSequence,
        quality: d.level === 0 ? 'mirror' : recipe.quality,
    }));
    const sh = stageKey('sh', V.sh, { pyramid, window: recipe.irradiance.shWindow, width: recipe.irradiance.shWindowWidth });
    const irradianceCube = stageKey('irradianceCube', V.irradianceCube, { pyramid, size: recipe.irradiance.cubeSize, source: recipe.irradiance.cubeSource, sh: recipe.irradiance.cubeSource === 'sh9' ? sh : null });
    const { dfg, lutFile } = lutKeys(recipe.dfg, recipe.output.supercompression);
    const fileOpts = { supercompression: recipe.output.supercompression };
    const specularFile = stageKey('specularFile', V.specularFile, { levels, format: recipe.output.specularFormat, ...fileOpts, source });
    const irradianceFile = stageKey('irradianceFile', V.irradianceFile, { irradianceCube, sh, format: recipe.output.irradianceFormat, ...fileOpts });
    const views = recipe.output.views.flatMap((format) => ['mirror', 'irradiance'].map((kind) => ({
        name: `${recipe.name}.${kind}.${format}`, kind, format,
        key: stageKey('view', V.view, { of: kind === 'mirror' ? levels[0] : irradianceCube, format }),
    })));
    const preview = stageKey('preview', V.preview, { specularFile, irradianceFile, lutFile: recipe.dfg.enabled ? lutFile : null, roughness: recipe.roughness });
    return { inputHash, source, pyramid, levels, sh, irradianceCube, dfg, specularFile, irradianceFile, lutFile, views, preview };
}
//# sourceMappingURL=keys.js.map