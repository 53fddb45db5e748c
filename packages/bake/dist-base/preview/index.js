/** Contact sheets from baked files on disk (the `lightkiln preview` command). */
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { decodeKtx2 } from '@lightkiln/codecs';
import { LightkilnError, toLightkilnError } from '../errors.js';
import { renderContactSheet } from './sheet.js';
/**
 * Renders the contact sheet of a probe from its manifest (`<probe>.probe.json`); the KTX 2.0 files are
 * read from the manifest's folder by the names it lists.
 */
export function previewFromManifest(manifestPath, exposureEv = 0) {
    let manifest;
    try {
        manifest = JSON.parse(readFileSync(manifestPath, 'utf8'));
    }
    catch (error) {
        throw new LightkilnError('INVALID_INPUT', `${manifestPath}: not a readable manifest (${error instanceof Error ? error.message : String(error)})`, { file: manifestPath, cause: error });
    }
    const find = (kind) => manifest.artifacts?.find((a) => a.kind === kind)?.path ?? null;
    const spec = find('specular');
    const irr = find('irradiance');
    if (manifest.levels === undefined || spec === null || irr === null) {
        throw new LightkilnError('INVALID_INPUT', `${manifestPath}: the manifest lists no specular and irradiance files`, { file: manifestPath });
    }
    const dir = dirname(manifestPath);
    const read = (name) => {
        if (name.includes('/') || name.includes('\\') || name.startsWith('.'))
            throw new LightkilnError('UNSAFE_PATH', `${manifestPath}: artifact name "${name}" is not a plain file name`);
        const path = join(dir, name);
        try {
            return decodeKtx2(readFileSync(path), { file: path });
        }
        catch (error) {
            throw toLightkilnError(error, path);
        }
    };
    const lut = find('lut');
    return renderContactSheet({
        probe: manifest.probe ?? 'probe',
        roughness: manifest.levels.map((l) => l.roughness),
        specular: read(spec),
        irradiance: read(irr),
        lut: lut === null ? null : read(lut),
        exposureEv,
    });
}
//# sourceMappingURL=index.js.map