/** Contact sheets from baked files on disk (the `lightkiln preview` command). */
/**
 * Renders the contact sheet of a probe from its manifest (`<probe>.probe.json`); the KTX 2.0 files are
 * read from the manifest's folder by the names it lists.
 */
export declare function previewFromManifest(manifestPath: string, exposureEv?: number): Uint8Array;
//# sourceMappingURL=index.d.ts.map