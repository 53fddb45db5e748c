/** Stage 6: the DFG lookup table (independent of the input, cached once per option set). */
import { type StageContext } from './context.js';
export interface DfgOptions {
    readonly size: number;
    readonly samples: number;
    readonly multiscatter: boolean;
    readonly cloth: boolean;
}
export interface DfgTable {
    readonly size: number;
    /** 2 (A, B) or 4 (A, B, E_avg or 0, cloth or 0). */
    readonly channels: number;
    readonly data: Float32Array;
    /** Names of the channels, in order, for the file's metadata. */
    readonly channelNames: readonly string[];
}
export declare function dfgChannelNames(options: DfgOptions): string[];
export declare function bakeDfgTable(options: DfgOptions, ctx: StageContext): Promise<DfgTable>;
//# sourceMappingURL=dfg.d.ts.map