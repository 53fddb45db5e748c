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
export {};
//# sourceMappingURL=events.js.map