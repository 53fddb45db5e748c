/** Readable summaries of every file lightkiln reads or writes (for `lightkiln inspect`). */
export interface ValueRange {
    readonly min: number;
    readonly max: number;
    readonly meanLuminance: number;
}
export interface FileSummary {
    readonly file: string;
    readonly format: string;
    readonly byteLength: number;
    readonly details: Readonly<Record<string, unknown>>;
}
/** Summarises a file by its signature (KTX 2.0, .hdr, .exr, .pfm, PNG, or a lightkiln manifest). */
export declare function inspectBytes(bytes: Uint8Array, file: string): FileSummary;
//# sourceMappingURL=inspect.d.ts.map