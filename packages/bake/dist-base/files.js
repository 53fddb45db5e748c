/**
 * Atomic file writes shared by the baker, the cache folder and the CLI: every file goes to a temp file in
 * its own folder (".<name>.tmp-<pid>-<random>"), then is renamed over the target, so readers see the old
 * file or the whole new one. A temp file is removed on every failure path; the ones alive at a signal are
 * removed by removeLiveTempFiles(); those a killed process left behind are swept by sweepStaleTempFiles()
 * (only when their pid is no longer running). A symbolic link at a target is refused, never followed.
 */
import { randomBytes } from 'node:crypto';
import { lstatSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { LightkilnError, unsafePath } from './errors.js';
const live = new Set();
const TEMP_NAME = /\.tmp-(\d+)-[0-9a-f]+$/;
/** A fresh temp path beside `path`, registered until it is renamed or removed. */
function tempPath(path) {
    const tmp = join(dirname(path), `.${basename(path)}.tmp-${process.pid}-${randomBytes(6).toString('hex')}`);
    live.add(tmp);
    return tmp;
}
function removeTemp(tmp) {
    live.delete(tmp);
    try {
        rmSync(tmp, { force: true });
    }
    catch {
        // Nothing more to do: the sweep of the next run removes it.
    }
}
/** Throws UNSAFE_PATH when `path` is a symbolic link (a write must never follow one). */
export function refuseSymlink(path) {
    try {
        if (lstatSync(path).isSymbolicLink())
            throw unsafePath(path, 'an existing symbolic link would be replaced');
    }
    catch (error) {
        if (error instanceof LightkilnError)
            throw error;
    }
}
/** The error of a failed write, naming the file and the system's reason (e.g. ENOSPC: the disk is full). */
export function writeError(path, error) {
    if (error instanceof LightkilnError)
        return error;
    const code = error.code;
    const reason = code === 'ENOSPC' ? 'no space left on the device' : code === 'EACCES' || code === 'EPERM' ? 'permission denied' : code === 'EROFS' ? 'read-only file system' : error instanceof Error ? error.message : String(error);
    return new LightkilnError('IO_ERROR', `cannot write ${path}: ${reason}${typeof code === 'string' ? ` (${code})` : ''}`, { file: path, cause: error });
}
/** Writes bytes to a temp file beside `final` (refusing a symlink there); the caller renames or discards it. */
export function stageFile(final, bytes) {
    refuseSymlink(final);
    const tmp = tempPath(final);
    try {
        writeFileSync(tmp, bytes, { flag: 'wx' });
    }
    catch (error) {
        removeTemp(tmp);
        throw writeError(final, error);
    }
    return { tmp, final };
}
/** Renames staged files over their targets, in order; removes them all on failure. */
export function commitFiles(files) {
    for (let i = 0; i < files.length; i++) {
        try {
            renameSync(files[i].tmp, files[i].final);
            live.delete(files[i].tmp);
        }
        catch (error) {
            discardFiles(files.slice(i));
            throw writeError(files[i].final, error);
        }
    }
}
export function discardFiles(files) {
    for (const f of files)
        removeTemp(f.tmp);
}
/** True when `path` is a regular file holding exactly `bytes` (so a rewrite can be skipped, mtime kept). */
export function sameContent(path, bytes) {
    try {
        const st = lstatSync(path);
        if (!st.isFile() || st.size !== bytes.length)
            return false;
        return Buffer.compare(readFileSync(path), bytes) === 0;
    }
    catch {
        return false;
    }
}
/** Writes one file atomically. */
export function writeFileAtomic(path, bytes) {
    commitFiles([stageFile(path, bytes)]);
}
/**
 * Writes several files atomically as a set (all staged first, then renamed; nothing renamed when one
 * fails), creating their folders. Symbolic links at any target are refused before anything is written.
 */
export function writeFilesAtomic(files) {
    for (const f of files)
        refuseSymlink(f.path);
    for (const f of files) {
        try {
            mkdirSync(dirname(f.path), { recursive: true });
        }
        catch (error) {
            throw writeError(dirname(f.path), error);
        }
    }
    const staged = [];
    try {
        for (const f of files)
            staged.push(stageFile(f.path, f.bytes));
    }
    catch (error) {
        discardFiles(staged);
        throw error;
    }
    commitFiles(staged);
}
/** Removes every temp file this process has open (called on SIGINT / SIGTERM before exiting). */
export function removeLiveTempFiles() {
    const n = live.size;
    for (const tmp of [...live])
        removeTemp(tmp);
    return n;
}
function processAlive(pid) {
    if (pid === process.pid)
        return true;
    try {
        process.kill(pid, 0);
        return true;
    }
    catch (error) {
        return error.code === 'EPERM';
    }
}
/** Finds the temp files of dead processes in `dir` (not recursive) and removes them unless dryRun. */
export function sweepStaleTempFiles(dir, dryRun = false) {
    let files = 0;
    let bytes = 0;
    let names;
    try {
        names = readdirSync(dir);
    }
    catch {
        return { files, bytes };
    }
    for (const name of names) {
        const m = TEMP_NAME.exec(name);
        if (m === null || !name.startsWith('.') || processAlive(Number(m[1])))
            continue;
        const path = join(dir, name);
        try {
            const st = lstatSync(path);
            if (!st.isFile())
                continue;
            files++;
            bytes += st.size;
            if (!dryRun)
                rmSync(path, { force: true });
        }
        catch {
            // gone meanwhile
        }
    }
    return { files, bytes };
}
/** statSync that returns null instead of throwing. */
export function statOrNull(path) {
    try {
        return statSync(path);
    }
    catch {
        return null;
    }
}
//# sourceMappingURL=files.js.map