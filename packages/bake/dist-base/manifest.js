/** The `<probe>.probe.json` manifest (the repo README, "The library"): everything a consumer needs without the code. */
import { roughnessToLodFormula } from './recipe.js';
export const MANIFEST_SCHEMA_VERSION = 1;
export { TOOL_NAME, TOOL_VERSION } from './version.js';
import { TOOL_NAME, TOOL_VERSION } from './version.js';
export const CONVENTIONS = {
    frame: 'right-handed, +Y up, -Z forward',
    cubeFaces: '+X, -X, +Y, -Y, +Z, -Z; OpenGL/Vulkan selection table; row 0 of a face is t = 0',
    roughness: 'perceptual roughness r; GGX alpha = r^2',
    specular: 'split-sum prefiltered radiance LD(n) with n = v = r, GGX D, NoL weights',
    irradiance: 'E(n) = integral L(l) max(n.l, 0) dl (Lambertian radiance = albedo * E / pi)',
    rotation: 'about +Y, right-handed; the cube at d shows the source at R(-rotationDeg) d',
};
/** SH coefficients as 9 [r, g, b] triples in the order of the manifest's `sh.basis`. */
export function shTriples(coeffs) {
    return Array.from({ length: 9 }, (_, k) => [coeffs[3 * k], coeffs[3 * k + 1], coeffs[3 * k + 2]]);
}
export function assembleManifest(p) {
    const r = p.recipe;
    return {
        schemaVersion: MANIFEST_SCHEMA_VERSION,
        tool: { name: TOOL_NAME, version: TOOL_VERSION },
        probe: r.name,
        inputs: p.inputs.map((i, k) => ({ path: i.name, byteLength: i.bytes.length, sha256: p.inputHashes[k] })),
        recipe: r,
        conventions: CONVENTIONS,
        roughnessToLod: roughnessToLodFormula(r.roughness),
        levels: p.levels,
        sh: {
            basis: 'real SH9, order (Y00, Y1-1 y, Y10 z, Y11 x, Y2-2 xy, Y2-1 yz, Y20 3z^2-1, Y21 xz, Y22 x^2-y^2), no Condon-Shortley phase',
            window: { kind: r.irradiance.shWindow, width: r.irradiance.shWindowWidth },
            radiance: shTriples(p.sh.radiance),
            irradiance: shTriples(p.sh.irradiance),
        },
        irradianceCube: { size: r.irradiance.cubeSize, source: r.irradiance.cubeSource, stores: 'E (irradiance), not E / pi' },
        lut: p.lutChannels === null ? null : { size: r.dfg.size, samples: r.dfg.samples, channels: p.lutChannels },
        artifacts: p.artifacts,
        sanitized: p.sanitized,
        clampedToFormat: p.clampedToFormat,
        timingsMs: Object.fromEntries(Object.entries(p.timingsMs).map(([k, v]) => [k, Math.round(v * 10) / 10])),
        cache: { ...p.cache },
    };
}
//# sourceMappingURL=manifest.js.map