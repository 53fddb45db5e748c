/**
 * What travels through Redis: a job per probe whose id is the bake's identity (the resolved recipe and the
 * inputs' SHA-256, hashed), so two submissions of one recipe bake once; its data is the recipe without
 * input bytes plus the inputs' digests (the bytes travel through the shared cache, never inside Redis);
 * its result lists the artifacts by digest (their bytes are in the shared cache too).
 */

import { createHash } from 'node:crypto';
import { resolveRecipe, type Recipe } from '@lightkiln/bake';

export const DEFAULT_QUEUE = 'lightkiln-bakes';

export interface FarmInput {
  readonly name: string;
  readonly digest: string;
  readonly byteLength: number;
}

export interface FarmJobData {
  /** The recipe minus its input (name, size, levels, ...). */
  readonly recipe: Omit<Recipe, 'input'>;
  /** One equirect/KTX input, or six faces (+X, -X, +Y, -Y, +Z, -Z). */
  readonly inputs: readonly FarmInput[];
  readonly layout?: 'auto' | 'equirect' | 'cube';
}

export interface FarmArtifact {
  readonly kind: string;
  readonly name: string;
  readonly sha256: string;
  readonly byteLength: number;
}

export interface FarmJobResult {
  readonly probe: string;
  readonly artifacts: readonly FarmArtifact[];
  /** Milliseconds the worker spent, and whether everything came from the shared cache. */
  readonly ms: number;
  readonly fromCache: boolean;
  readonly worker: string;
}

/** The job id: SHA-256 of the resolved recipe (input fields dropped) and the input digests. */
export function jobIdFor(data: FarmJobData): string {
  const stub: Recipe = { ...data.recipe, input: { bytes: new Uint8Array(0), name: data.inputs[0]?.name ?? 'input' } } as Recipe;
  const { input: _input, ...resolved } = resolveRecipe(stub);
  return createHash('sha256').update(JSON.stringify({ recipe: resolved, inputs: data.inputs.map((i) => i.digest), layout: data.layout ?? 'auto' })).digest('hex');
}
