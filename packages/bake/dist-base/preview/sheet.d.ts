/**
 * The preview contact sheet (PNG): every specular level unfolded as a cross with its roughness, the
 * irradiance cube, spheres shaded with the baked assets (split-sum specular F0 * A + B from the DFG table,
 * plus Lambertian diffuse rho E / pi for the dielectric), and the DFG table itself.
 */
import { type Ktx2File } from '@lightkiln/codecs';
export interface PreviewInput {
    readonly probe: string;
    readonly specular: Ktx2File;
    readonly roughness: readonly number[];
    readonly irradiance: Ktx2File;
    readonly lut: Ktx2File | null;
    /** Exposure in stops on top of the automatic exposure (log-average luminance to 0.18). Default 0. */
    readonly exposureEv?: number;
}
/** Renders the contact sheet as PNG bytes. */
export declare function renderContactSheet(input: PreviewInput): Uint8Array;
//# sourceMappingURL=sheet.d.ts.map