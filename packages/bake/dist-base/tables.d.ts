/**
 * The bake as data: one table of stages (the cached intermediates, each with the stages it reads) and one
 * table of artifacts (the files a bake returns, each with its key, name, format, the stages it needs and
 * how it is built). Baker.bake builds the artifact rows, Baker.plan walks both tables, and the cache
 * events take their labels from them: adding an artifact or a stage is a row here (and its builder).
 */
import type { Keys } from './keys.js';
import type { ManifestLevel } from './manifest.js';
import { type ResolvedRecipe } from './recipe.js';
import { type BakeRun } from './run.js';
import type { SanitizeCounts } from './stages/source.js';
export type ArtifactKind = 'specular' | 'irradiance' | 'lut' | 'view' | 'preview' | 'manifest';
/** A cached intermediate: its label (cache events, plan), key and the stages it reads. */
export interface StageRow {
    readonly name: string;
    readonly key: string;
    readonly inputs: readonly string[];
}
export declare function stageRows(keys: Keys): StageRow[];
export interface SpecularMeta {
    levels: ManifestLevel[];
    sanitized: SanitizeCounts;
    clamped: number;
}
export interface IrradianceMeta {
    radiance: number[];
    irradiance: number[];
    clamped: number;
}
export interface LutMeta {
    channels: string[];
}
/** A file of the bake: its bytes, the manifest fragments it carries and whether the cache had it. */
export interface BuiltFile {
    readonly bytes: Uint8Array;
    readonly meta: unknown;
    readonly fromCache: boolean;
}
/** The phase 1 files once built (the contact sheet and the manifest read them). */
export interface BuiltFiles {
    specular?: {
        bytes: Uint8Array;
        meta: SpecularMeta;
    };
    irradiance?: {
        bytes: Uint8Array;
        meta: IrradianceMeta;
    };
    lut?: {
        bytes: Uint8Array;
        meta: LutMeta;
    };
}
/**
 * A file the bake returns. Rows of `phase` 1 are built side by side (the DFG table and the irradiance do
 * not wait for the specular chain); phase 2 rows read phase 1 results (views, the contact sheet).
 */
export interface ArtifactRow {
    readonly kind: Exclude<ArtifactKind, 'manifest'>;
    readonly name: string;
    readonly key: string;
    /** Cache label of the finished file. */
    readonly label: string;
    readonly phase: 1 | 2;
    /** Stages a bake must compute when this file is not cached. */
    readonly stages: readonly string[];
    readonly format: (meta: unknown) => string;
    readonly build: (run: BakeRun, built: BuiltFiles) => Promise<{
        bytes: Uint8Array;
        meta: unknown;
    }>;
}
export declare function artifactRows(r: ResolvedRecipe, keys: Keys): ArtifactRow[];
/** The DFG table's file: it needs no input, so a bake may start it before the input is read. */
export declare function lutRow(r: ResolvedRecipe, lutFile: string): ArtifactRow;
/** Cache-event labels of every key of a bake. */
export declare function keyLabels(recipe: ResolvedRecipe, keys: Keys): Map<string, string>;
export interface PlanItem {
    readonly kind: string;
    readonly key: string;
    readonly cached: boolean;
    /** True when a bake would compute (not read) this item. */
    readonly willCompute: boolean;
}
/**
 * What a bake would read and compute, given which keys are cached: every missing artifact needs its
 * stages; a needed stage that is not cached is computed and needs its inputs in turn.
 */
export declare function planFromTables(recipe: ResolvedRecipe, keys: Keys, cached: (key: string) => boolean): {
    artifacts: (PlanItem & {
        name: string;
    })[];
    stages: PlanItem[];
};
//# sourceMappingURL=tables.d.ts.map