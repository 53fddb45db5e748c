/** The `<probe>.probe.json` manifest (the repo README, "The library"): everything a consumer needs without the code. */

import { roughnessToLodFormula, type ResolvedRecipe } from './recipe.js';
import type { InputFile, SanitizeCounts } from './stages/source.js';

export const MANIFEST_SCHEMA_VERSION = 1;
export { TOOL_NAME, TOOL_VERSION } from './version.js';
import { TOOL_NAME, TOOL_VERSION } from './version.js';

export interface ManifestLevel {
  readonly level: number;
  readonly size: number;
  readonly roughness: number;
  /** Samples per texel requested, and those with n.l > 0 actually used (source texels for reference). */
  readonly samples: number;
  readonly usedSamples: number;
  /**
   * Estimated RMS over texels of the relative error in BT.709 luminance (each texel's error over its own
   * luminance; 0 = exact at this level). See the bake README for how each method estimates it.
   */
  readonly relativeErrorEstimate: number;
}

export interface ManifestArtifact {
  readonly kind: 'specular' | 'irradiance' | 'lut' | 'view' | 'preview';
  readonly path: string;
  readonly format: string;
  readonly byteLength: number;
  readonly sha256: string;
}

export interface Manifest {
  readonly schemaVersion: number;
  readonly tool: { readonly name: string; readonly version: string };
  readonly probe: string;
  readonly inputs: readonly { readonly path: string; readonly byteLength: number; readonly sha256: string }[];
  readonly recipe: Omit<ResolvedRecipe, 'input'> & { readonly input: { readonly path: string | null; readonly name: string; readonly layout: string; readonly faces: readonly string[] | null } };
  readonly conventions: Readonly<Record<string, string>>;
  /**
   * The level of detail a shader samples the specular chain at for perceptual roughness r, as a formula
   * to copy, e.g. "lod = (L - 1) * pow(r, 0.8), L = 6" (textureLod(cube, R, lod)).
   */
  readonly roughnessToLod: string;
  readonly levels: readonly ManifestLevel[];
  readonly sh: {
    readonly basis: string;
    readonly window: { readonly kind: string; readonly width: number };
    readonly radiance: readonly (readonly [number, number, number])[];
    readonly irradiance: readonly (readonly [number, number, number])[];
  };
  readonly irradianceCube: { readonly size: number; readonly source: string; readonly stores: string };
  readonly lut: { readonly size: number; readonly samples: number; readonly channels: readonly string[] } | null;
  readonly artifacts: readonly ManifestArtifact[];
  readonly sanitized: SanitizeCounts;
  /** Texels of each written cube clamped to the largest finite value of its format (never Inf in a file). */
  readonly clampedToFormat: { readonly specular: number; readonly irradiance: number };
  readonly timingsMs: Readonly<Record<string, number>>;
  readonly cache: { readonly hits: number; readonly misses: number; readonly corrupt: number; readonly writes: number };
}

export const CONVENTIONS: Readonly<Record<string, string>> = {
  frame: 'right-handed, +Y up, -Z forward',
  cubeFaces: '+X, -X, +Y, -Y, +Z, -Z; OpenGL/Vulkan selection table; row 0 of a face is t = 0',
  roughness: 'perceptual roughness r; GGX alpha = r^2',
  specular: 'split-sum prefiltered radiance LD(n) with n = v = r, GGX D, NoL weights',
  irradiance: 'E(n) = integral L(l) max(n.l, 0) dl (Lambertian radiance = albedo * E / pi)',
  rotation: 'about +Y, right-handed; the cube at d shows the source at R(-rotationDeg) d',
};

/** SH coefficients as 9 [r, g, b] triples in the order of the manifest's `sh.basis`. */
export function shTriples(coeffs: ArrayLike<number>): [number, number, number][] {
  return Array.from({ length: 9 }, (_, k) => [coeffs[3 * k]!, coeffs[3 * k + 1]!, coeffs[3 * k + 2]!] as [number, number, number]);
}

/** What the manifest is assembled from: the bake's recipe and inputs, and the metadata its files carried. */
export interface ManifestParts {
  readonly recipe: ResolvedRecipe;
  readonly inputs: readonly InputFile[];
  readonly inputHashes: readonly string[];
  readonly levels: readonly ManifestLevel[];
  readonly sh: { readonly radiance: readonly number[]; readonly irradiance: readonly number[] };
  readonly lutChannels: readonly string[] | null;
  readonly artifacts: readonly ManifestArtifact[];
  readonly sanitized: SanitizeCounts;
  readonly clampedToFormat: { readonly specular: number; readonly irradiance: number };
  readonly timingsMs: Readonly<Record<string, number>>;
  readonly cache: Manifest['cache'];
}

export function assembleManifest(p: ManifestParts): Manifest {
  const r = p.recipe;
  return {
    schemaVersion: MANIFEST_SCHEMA_VERSION,
    tool: { name: TOOL_NAME, version: TOOL_VERSION },
    probe: r.name,
    inputs: p.inputs.map((i, k) => ({ path: i.name, byteLength: i.bytes.length, sha256: p.inputHashes[k]! })),
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
