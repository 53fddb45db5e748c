/** Writing a bake's artifacts into its output folder: checks, unchanged files left alone, all or nothing. */
import type { BakedArtifact } from './bake.js';
export declare function checkOutputFolder(outDir: string, probe: string): void;
/**
 * Writes every artifact to a temp file first, then renames all of them; on failure removes the temps.
 * An artifact whose file already holds the same bytes (a manifest: the same but for timings and cache
 * statistics) is left alone (its mtime kept, for build systems).
 * Stale temp files of killed runs in the folder are swept first.
 */
export declare function writeAtomically(outDir: string, artifacts: readonly BakedArtifact[]): Set<string>;
//# sourceMappingURL=write.d.ts.map