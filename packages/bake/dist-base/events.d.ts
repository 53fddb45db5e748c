/**
 * Structured events of a bake (BakeRunOptions.onEvent; `lightkiln bake --events` prints them as JSON lines
 * on stderr), for build-system dashboards. Every event has `type`; the others:
 *
 * - `stage`: `stage` (decode, resample, specular, irradiance, dfg, encode), `state` 'started' | 'finished',
 *   and on finish `ms` (wall time; stages of the three files run side by side, so they overlap).
 * - `progress`: `stage`, `done`, `total` (cost units), at most every 100 ms per pool job.
 * - `cache`: `entry` (source, pyramid, level N, sh, irradiance cube, dfg, specular file, irradiance file,
 *   lut file, view NAME, preview), `hit` true | false (false: computed now).
 * - `artifact`: `kind`, `name`, `path` (null without outDir), `sha256`, `bytes`, `written` (false when an
 *   identical file was already there and was left alone), `fromCache`.
 */
export type BakeEvent = {
    readonly type: 'stage';
    readonly stage: string;
    readonly state: 'started' | 'finished';
    readonly ms?: number;
} | {
    readonly type: 'progress';
    readonly stage: string;
    readonly done: number;
    readonly total: number;
} | {
    readonly type: 'cache';
    readonly entry: string;
    readonly hit: boolean;
} | {
    readonly type: 'artifact';
    readonly kind: string;
    readonly name: string;
    readonly path: string | null;
    readonly sha256: string;
    readonly bytes: number;
    readonly written: boolean;
    readonly fromCache: boolean;
};
//# sourceMappingURL=events.d.ts.map