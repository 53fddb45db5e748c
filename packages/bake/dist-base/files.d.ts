/**
 * Atomic file writes shared by the baker, the cache folder and the CLI: every file goes to a temp file in
 * its own folder (".<name>.tmp-<pid>-<random>"), then is renamed over the target, so readers see the old
 * file or the whole new one. A temp file is removed on every failure path; the ones alive at a signal are
 * removed by removeLiveTempFiles(); those a killed process left behind are swept by sweepStaleTempFiles()
 * (only when their pid is no longer running). A symbolic link at a target is refused, never followed.
 */
import { statSync } from 'node:fs';
import { LightkilnError } from './errors.js';
/** Throws UNSAFE_PATH when `path` is a symbolic link (a write must never follow one). */
export declare function refuseSymlink(path: string): void;
/** The error of a failed write, naming the file and the system's reason (e.g. ENOSPC: the disk is full). */
export declare function writeError(path: string, error: unknown): LightkilnError;
export interface StagedFile {
    readonly tmp: string;
    readonly final: string;
}
/** Writes bytes to a temp file beside `final` (refusing a symlink there); the caller renames or discards it. */
export declare function stageFile(final: string, bytes: Uint8Array): StagedFile;
/** Renames staged files over their targets, in order; removes them all on failure. */
export declare function commitFiles(files: readonly StagedFile[]): void;
export declare function discardFiles(files: readonly StagedFile[]): void;
/** True when `path` is a regular file holding exactly `bytes` (so a rewrite can be skipped, mtime kept). */
export declare function sameContent(path: string, bytes: Uint8Array): boolean;
/** Writes one file atomically. */
export declare function writeFileAtomic(path: string, bytes: Uint8Array): void;
/**
 * Writes several files atomically as a set (all staged first, then renamed; nothing renamed when one
 * fails), creating their folders. Symbolic links at any target are refused before anything is written.
 */
export declare function writeFilesAtomic(files: readonly {
    readonly path: string;
    readonly bytes: Uint8Array;
}[]): void;
/** Removes every temp file this process has open (called on SIGINT / SIGTERM before exiting). */
export declare function removeLiveTempFiles(): number;
export interface TempSweep {
    /** Stale temp files found (their process is gone) and their bytes; removed unless dryRun. */
    readonly files: number;
    readonly bytes: number;
}
/** Finds the temp files of dead processes in `dir` (not recursive) and removes them unless dryRun. */
export declare function sweepStaleTempFiles(dir: string, dryRun?: boolean): TempSweep;
/** statSync that returns null instead of throwing. */
export declare function statOrNull(path: string): ReturnType<typeof statSync> | null;
//# sourceMappingURL=files.d.ts.map