/**
 * The bake recipe: what to bake and how. `Recipe` (every field optional but the input) goes through
 * resolveRecipe() to give `ResolvedRecipe` (every field filled in), validated by a zod schema whose
 * errors name the field path and the rule.
 */
import { z } from 'zod';
import { invalidRecipe } from './errors.js';
/**
 * Per-level sample counts of the presets, linear in roughness from the first value (r -> 0) to the second
 * (r = 1), rounded to a multiple of 8. 'default' keeps every level within 1% relative RMSE of the
 * reference convolution on the analytic sky of packages/bake/test/accuracy.test.ts (0.64% worst, size 64).
 */
export const SAMPLE_PRESETS = {
    draft: [64, 256],
    default: [256, 1024],
    high: [1024, 4096],
};
const isPow2 = (n) => Number.isInteger(n) && n > 0 && (n & (n - 1)) === 0;
/** Artifact base names: letters, digits, '.', '_' and '-', not starting with '.', at most 100 characters. */
export const SAFE_NAME = /^[A-Za-z0-9_][A-Za-z0-9._-]{0,99}$/;
const cubeFormat = z.enum(['rgba16f', 'rgba32f', 'rgb9e5', 'b10g11r11']);
const schema = z.object({
    input: z.object({
        path: z.string().min(1).optional(),
        bytes: z.instanceof(Uint8Array).optional(),
        name: z.string().min(1).max(200).optional(),
        layout: z.enum(['auto', 'equirect', 'cube']).default('auto'),
        faces: z.array(z.string().min(1)).length(6, 'must list exactly six face files (+X, -X, +Y, -Y, +Z, -Z)').optional(),
    }).strict().refine((i) => [i.path, i.bytes, i.faces].filter((v) => v !== undefined).length === 1, 'give exactly one of path, bytes or faces'),
    name: z.string().regex(SAFE_NAME, 'must be a plain file name (letters, digits, . _ -, not starting with .)').optional(),
    rotationDeg: z.number().finite().min(-3600).max(3600).default(0),
    size: z.number().int().min(4).max(4096).refine(isPow2, 'must be a power of two').default(256),
    levels: z.number().int().min(1).max(13).optional(),
    roughness: z.array(z.number().min(0).max(1)).min(1).optional(),
    samples: z.union([z.enum(['draft', 'default', 'high']), z.number().int().min(1), z.array(z.number().int().min(1)).min(1)]).default('default'),
    filtered: z.boolean().default(true),
    lodBias: z.number().min(-4).max(8).default(0.5),
    clampLuminance: z.number().min(0).finite().default(0),
    rotateSequence: z.boolean().default(false),
    quality: z.enum(['quadrature', 'sampled', 'reference']).default('quadrature'),
    irradiance: z.object({
        shWindow: z.enum(['none', 'hann', 'lanczos']).default('none'),
        shWindowWidth: z.number().min(1).max(16).default(3),
        cubeSize: z.number().int().min(1).max(256).refine(isPow2, 'must be a power of two').default(32),
        cubeSource: z.enum(['convolution', 'sh9']).default('convolution'),
    }).strict().default({ shWindow: 'none', shWindowWidth: 3, cubeSize: 32, cubeSource: 'convolution' }),
    dfg: z.object({
        enabled: z.boolean().default(true),
        size: z.number().int().min(8).max(1024).default(128),
        samples: z.number().int().min(16).max(65536).default(1024),
        multiscatter: z.boolean().default(false),
        cloth: z.boolean().default(false),
    }).strict().default({ enabled: true, size: 128, samples: 1024, multiscatter: false, cloth: false }),
    output: z.object({
        specularFormat: cubeFormat.default('rgba16f'),
        irradianceFormat: cubeFormat.default('rgba16f'),
        supercompression: z.enum(['none', 'zlib', 'zstd']).default('none'),
        views: z.array(z.enum(['hdr', 'exr'])).default([]),
        preview: z.boolean().default(false),
    }).strict().default({ specularFormat: 'rgba16f', irradianceFormat: 'rgba16f', supercompression: 'none', views: [], preview: false }),
    sanitize: z.object({
        nonFinite: z.enum(['repair', 'reject']).default('repair'),
        negative: z.enum(['clamp', 'reject']).default('clamp'),
        maxRadiance: z.number().positive().finite().max(1e30).default(1e9),
    }).strict().default({ nonFinite: 'repair', negative: 'clamp', maxRadiance: 1e9 }),
    limits: z.object({
        maxInputBytes: z.number().int().positive().default(1024 ** 3),
        maxInputPixels: z.number().int().positive().default(8192 * 8192),
        maxSamples: z.number().int().positive().max(1 << 20).default(65536),
        maxWork: z.number().positive().default(2e11),
    }).strict().default({ maxInputBytes: 1024 ** 3, maxInputPixels: 8192 * 8192, maxSamples: 65536, maxWork: 2e11 }),
}).strict();
function formatIssues(error) {
    return error.issues.map((issue) => `${issue.path.length > 0 ? issue.path.join('.') : '(recipe)'}: ${issue.message}`).join('; ');
}
function baseName(path) {
    const file = path.split(/[\\/]/).pop() ?? path;
    const dot = file.lastIndexOf('.');
    return (dot > 0 ? file.slice(0, dot) : file).replace(/[^A-Za-z0-9._-]/g, '_').replace(/^[.]+/, '') || 'probe';
}
/** Validates a recipe and fills in every default; throws LightkilnError INVALID_RECIPE naming each bad field. */
/**
 * The default chain stops at 8 x 8 faces from size 256 up, at 4 x 4 below: smaller faces cannot hold the
 * rough lobes under bilinear filtering (sampled like a shader, a 1 x 1 last level was 8-12% off at r = 1,
 * a 4 x 4 one 1.2%, an 8 x 8 one 0.3%), while below 256 the extra level keeps the roughness steps small
 * enough for the trilinear blend (at 128, stopping at 8 x 8 left 1.5% at r = 0.3; see
 * packages/bake/test/runtime-sampling.test.ts). At least 2 levels, at most the full chain.
 */
export function defaultLevelCount(size) {
    const smallest = size >= 256 ? 8 : 4;
    return Math.min(Math.log2(size) + 1, Math.max(2, Math.log2(size / smallest) + 1));
}
/** Exponent of the default roughness spacing: r_m = (m / (L - 1))^ROUGHNESS_EXPONENT. */
export const ROUGHNESS_EXPONENT = 1.25;
/**
 * Perceptual roughness of level m of L by default: (m / (L - 1))^1.25, denser at low roughness, where the
 * lobe (alpha = r^2) changes fastest relative to itself. Chosen by the shader-side measure (runtime
 * sampling against the exact convolution) among powers 1 to 2 and smallest faces 4 to 32.
 */
export function levelRoughness(m, levels) {
    return (m / (levels - 1)) ** ROUGHNESS_EXPONENT;
}
/**
 * The roughness-to-LOD mapping a shader uses for a chain, as text: the inverse of levelRoughness for the
 * default spacing, else the piecewise-linear interpolation through (r_m, m).
 */
export function roughnessToLodFormula(roughness) {
    const L = roughness.length;
    if (L < 2)
        return 'lod = 0';
    const isDefault = roughness.every((r, m) => Math.abs(r - levelRoughness(m, L)) < 1e-12);
    if (isDefault)
        return `lod = (L - 1) * pow(r, ${1 / ROUGHNESS_EXPONENT}), L = ${L}`;
    return `lod = m + (r - r_m) / (r_(m+1) - r_m) for r_m <= r <= r_(m+1), r_m = [${roughness.join(', ')}], L = ${L}`;
}
/** The chain's levels; `samples` overrides the recipe's per-level counts (the sweep tries other budgets). */
export function levelDescriptors(recipe, samples = recipe.samples) {
    return recipe.roughness.map((perceptualRoughness, level) => ({
        level,
        faceSize: Math.max(1, recipe.size >> level),
        perceptualRoughness,
        requestedSamples: level === 0 ? 0 : samples[level],
    }));
}
/**
 * Face size of the source pyramid's finest level: the output size, doubled (up to 4 x and 512) while a
 * face-centre texel (2 / size radians) is wider than half the GGX alpha of the sharpest level r > 0, and
 * while the source still resolves it (a texel at least two source pixels wide; `sourcePixelAngle`, radians,
 * unknown before decoding gives the upper bound). The quadrature's finest nodes then stay small against
 * every lobe, so a sun a few texels wide is integrated from its own pieces (measured against the
 * convolution of the image: a 2-degree 1e4 x sun at r = 0.18 on 32 x 32 faces, worst texel 0.29% with
 * 64 x 64 leaves, 0.13% with 128 x 128; a 128 bake takes about 10% longer). The mirror level is the
 * pyramid level of the output size. Defaults from a 2048-wide image: 64 -> 128, 128 -> 256, 256 and up
 * unchanged; quality 'reference' keeps the output size (its cost grows as the base size^4).
 */
export function pyramidBaseSize(recipe, sourcePixelAngle = 0) {
    if (recipe.quality === 'reference')
        return recipe.size;
    const sharpest = recipe.roughness.length > 1 ? recipe.roughness[1] : 1;
    const alpha = sharpest * sharpest;
    let base = recipe.size;
    while (base < 4 * recipe.size && base < 512 && 2 / base > 0.5 * alpha && 1 / (2 * base) >= sourcePixelAngle)
        base *= 2;
    return base;
}
/** The mapping of roughnessToLodFormula as a number: the level of detail for perceptual roughness r. */
export function roughnessToLod(r, roughness) {
    const L = roughness.length;
    if (L < 2)
        return 0;
    const x = Math.min(1, Math.max(0, r));
    if (roughness.every((v, m) => Math.abs(v - levelRoughness(m, L)) < 1e-12))
        return (L - 1) * x ** (1 / ROUGHNESS_EXPONENT);
    for (let m = 0; m + 1 < L; m++)
        if (x <= roughness[m + 1])
            return m + Math.max(0, (x - roughness[m]) / (roughness[m + 1] - roughness[m]));
    return L - 1;
}
/** The DFG table's own options (Baker.lut): validated as the recipe's `dfg` and `output.supercompression`. */
export function resolveLutOptions(options) {
    const { supercompression, ...dfg } = options;
    const parsed = z.object({ dfg: schema.shape.dfg, supercompression: schema.shape.output.unwrap().shape.supercompression }).safeParse({ dfg: { ...dfg, enabled: true }, supercompression });
    if (!parsed.success)
        throw invalidRecipe(formatIssues(parsed.error));
    return parsed.data;
}
export function resolveRecipe(recipe) {
    const parsed = schema.safeParse(recipe);
    if (!parsed.success)
        throw invalidRecipe(formatIssues(parsed.error));
    const r = parsed.data;
    const maxLevels = Math.log2(r.size) + 1;
    const levels = r.levels ?? r.roughness?.length ?? defaultLevelCount(r.size);
    if (levels > maxLevels)
        throw invalidRecipe(`levels: at most ${maxLevels} levels for size ${r.size} (down to 1 x 1), got ${levels}`);
    let roughness;
    if (r.roughness !== undefined) {
        if (r.roughness.length !== levels)
            throw invalidRecipe(`roughness: must list one value per level (${levels}), got ${r.roughness.length}`);
        if (r.roughness[0] !== 0)
            throw invalidRecipe('roughness: level 0 is the mirror level and must be 0');
        for (let i = 1; i < levels; i++) {
            if (r.roughness[i] <= r.roughness[i - 1])
                throw invalidRecipe(`roughness: values must increase (roughness.${i} = ${r.roughness[i]})`);
        }
        roughness = [...r.roughness];
    }
    else {
        roughness = Array.from({ length: levels }, (_, m) => (levels === 1 ? 0 : levelRoughness(m, levels)));
    }
    let samples;
    let samplePreset = 'custom';
    if (typeof r.samples === 'string') {
        samplePreset = r.samples;
        const [lo, hi] = SAMPLE_PRESETS[r.samples];
        samples = roughness.map((rough) => Math.max(8, Math.round((lo + (hi - lo) * rough) / 8) * 8));
    }
    else if (typeof r.samples === 'number') {
        samples = roughness.map(() => r.samples);
    }
    else {
        if (r.samples.length !== levels)
            throw invalidRecipe(`samples: must list one count per level (${levels}), got ${r.samples.length}`);
        samples = [...r.samples];
    }
    samples.forEach((s, i) => {
        if (i > 0 && s > r.limits.maxSamples)
            throw invalidRecipe(`samples.${i}: ${s} exceeds limits.maxSamples (${r.limits.maxSamples})`);
    });
    let work = 0;
    const base = pyramidBaseSize({ size: r.size, roughness, quality: r.quality });
    for (let m = 1; m < levels; m++)
        work += 6 * Math.max(1, r.size >> m) ** 2 * (r.quality === 'reference' ? 6 * base * base : samples[m]);
    work += r.dfg.enabled ? r.dfg.size * r.dfg.size * r.dfg.samples : 0;
    // The irradiance cube by direct convolution: every output texel sums every texel of a source level of
    // at most 64 x 64 faces (stages/irradiance.ts).
    if (r.irradiance.cubeSource === 'convolution')
        work += 6 * r.irradiance.cubeSize ** 2 * 6 * Math.min(r.size, 64) ** 2;
    if (work > r.limits.maxWork)
        throw invalidRecipe(`the bake needs about ${work.toExponential(2)} sample evaluations, over limits.maxWork (${r.limits.maxWork.toExponential(2)}); lower size, samples, irradiance.cubeSize or raise the limit`);
    const inputName = r.input.name ?? (r.input.path !== undefined ? r.input.path : r.input.faces !== undefined ? r.input.faces[0] : 'input');
    const name = r.name ?? (r.input.path !== undefined ? baseName(r.input.path) : r.input.faces !== undefined ? baseName(r.input.faces[0]) : baseName(inputName));
    if (!SAFE_NAME.test(name))
        throw invalidRecipe(`name: "${name}" must be a plain file name`);
    return {
        input: { path: r.input.path ?? null, name: inputName, layout: r.input.layout, faces: r.input.faces ?? null },
        name,
        rotationDeg: r.rotationDeg,
        size: r.size,
        levels,
        roughness,
        samples,
        samplePreset,
        filtered: r.filtered,
        lodBias: r.lodBias,
        clampLuminance: r.clampLuminance,
        rotateSequence: r.rotateSequence,
        quality: r.quality,
        irradiance: r.irradiance,
        dfg: r.dfg,
        output: r.output,
        sanitize: r.sanitize,
        limits: r.limits,
    };
}
//# sourceMappingURL=recipe.js.map