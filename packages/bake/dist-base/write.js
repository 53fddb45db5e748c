/** Writing a bake's artifacts into its output folder: checks, unchanged files left alone, all or nothing. */
import { lstatSync, mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { LightkilnError, toLightkilnError, unsafePath } from './errors.js';
import { commitFiles, discardFiles, refuseSymlink, sameContent, stageFile, sweepStaleTempFiles, writeError } from './files.js';
import { SAFE_NAME } from './recipe.js';
export function checkOutputFolder(outDir, probe) {
    try {
        const st = lstatSync(outDir);
        if (st.isSymbolicLink())
            throw unsafePath(outDir, 'the output folder is a symbolic link');
        if (!st.isDirectory())
            throw new LightkilnError('INVALID_OPTION', `output folder ${outDir} exists and is not a folder`);
    }
    catch (error) {
        if (error instanceof LightkilnError)
            throw error;
        if (error.code !== 'ENOENT')
            throw toLightkilnError(error, outDir);
    }
    if (!SAFE_NAME.test(probe))
        throw unsafePath(probe, 'not a plain file name');
}
/**
 * True when the manifest at `path` differs from `bytes` at most in the fields that change on every run
 * (timings and cache statistics): an unchanged rebake then leaves it alone, as it leaves the other files.
 */
function sameManifest(path, bytes) {
    try {
        const strip = (text) => {
            const { timingsMs: _t, cache: _c, ...rest } = JSON.parse(text);
            return JSON.stringify(rest);
        };
        return strip(readFileSync(path, 'utf8')) === strip(new TextDecoder().decode(bytes));
    }
    catch {
        return false;
    }
}
/**
 * Writes every artifact to a temp file first, then renames all of them; on failure removes the temps.
 * An artifact whose file already holds the same bytes (a manifest: the same but for timings and cache
 * statistics) is left alone (its mtime kept, for build systems).
 * Stale temp files of killed runs in the folder are swept first.
 */
export function writeAtomically(outDir, artifacts) {
    try {
        mkdirSync(outDir, { recursive: true });
    }
    catch (error) {
        throw writeError(outDir, error);
    }
    sweepStaleTempFiles(outDir);
    const staged = [];
    const kept = new Set();
    try {
        for (const a of artifacts) {
            if (!SAFE_NAME.test(a.name))
                throw unsafePath(a.name, 'not a plain file name');
            const final = join(outDir, a.name);
            refuseSymlink(final);
            if (sameContent(final, a.bytes) || (a.kind === 'manifest' && sameManifest(final, a.bytes))) {
                kept.add(a.name);
                continue;
            }
            staged.push(stageFile(final, a.bytes));
        }
    }
    catch (error) {
        discardFiles(staged);
        throw error;
    }
    commitFiles(staged);
    return kept;
}
//# sourceMappingURL=write.js.map