/**
 * The sample-budget sweep: for each method and budget, bake the specular chain (levels >= 1) of one probe,
 * time it (median of repeats) and measure each level against the brute-force reference convolution:
 * relative RMSE of BT.709 luminance, and the 99.9th-percentile texel error (|Y - Y_ref| over the level's
 * mean reference luminance), where fireflies show. Writes nothing itself; see sweepReport() for files.
 */
import { type Recipe } from './recipe.js';
import type { BakeProgress } from './stages/context.js';
/** 'quadrature' is the default deterministic estimator: one point (it takes no sample budget). */
export type SweepMethod = 'plain' | 'filtered' | 'filtered-rotated' | 'quadrature';
export declare const SWEEP_METHODS: readonly SweepMethod[];
export interface SweepOptions {
    /** The probe: any recipe input (path or bytes); the recipe's other fields set size and roughness. */
    readonly recipe: Recipe;
    /** Uniform samples per texel to try, and/or "default" (the default preset's per-level ramp). */
    readonly budgets?: readonly (number | 'default')[];
    readonly methods?: readonly SweepMethod[];
    /** Timed repeats per point; the median is reported. Default 3. */
    readonly repeats?: number;
    readonly threads?: number;
    readonly signal?: AbortSignal;
    readonly onProgress?: (p: BakeProgress) => void;
}
export interface SweepPoint {
    readonly method: SweepMethod;
    readonly budget: number | 'default';
    /** Median wall time of the specular chain in milliseconds, and the repeats behind it. */
    readonly medianMs: number;
    readonly repeats: number;
    /** Per level (index = level, level 0 is exact and reported as 0). */
    readonly relativeRmse: readonly number[];
    readonly p999: readonly number[];
}
export interface SweepResult {
    readonly probe: string;
    readonly size: number;
    readonly roughness: readonly number[];
    readonly referenceMs: number;
    readonly points: readonly SweepPoint[];
    readonly summary: SweepSummary;
}
export interface SweepSummary {
    /** Cheapest filtered budget whose worst level is under 1% relative RMSE, and its time. */
    readonly cheapestUnderOnePercent: {
        readonly budget: number | 'default';
        readonly medianMs: number;
    } | null;
    /** Time of the default preset (filtered) and its ratio to the cheapest budget above. */
    readonly defaultMs: number | null;
    readonly defaultOverCheapest: number | null;
    /**
     * At the plain method's default-preset time: worst-level 99.9th-percentile error of the filtered
     * method divided by that of the plain method (log-log interpolation along each method's curve).
     */
    readonly filteredOverPlainP999AtDefaultTime: number | null;
}
export declare function sweepBudgets(options: SweepOptions): Promise<SweepResult>;
/** CSV, Markdown and SVG (error vs time, log-log, one line per method) of a sweep. */
export declare function sweepReport(result: SweepResult): {
    csv: string;
    markdown: string;
    svg: string;
};
//# sourceMappingURL=sweep.d.ts.map