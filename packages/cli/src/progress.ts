/**
 * Progress on stderr: a bar with throughput and ETA when stderr is a terminal, a plain line about every
 * two seconds otherwise, nothing with --quiet. Colour only on a terminal and never with NO_COLOR set.
 */

import type { BakeProgress } from '@lightkiln/bake';

export interface ProgressSink {
  readonly onProgress: (p: BakeProgress) => void;
  readonly log: (line: string) => void;
  done(): void;
}

export function createProgress(options: { quiet: boolean; label: string; stream?: NodeJS.WriteStream }): ProgressSink {
  const stream = options.stream ?? process.stderr;
  if (options.quiet) return { onProgress: () => {}, log: () => {}, done: () => {} };
  const tty = stream.isTTY === true;
  const colour = tty && !('NO_COLOR' in process.env);
  const started = new Map<string, number>();
  let lastPlain = 0;
  let drawn = false;
  const clear = (): void => {
    if (drawn) stream.write('\r\x1b[2K');
    drawn = false;
  };
  return {
    onProgress(p: BakeProgress): void {
      const now = performance.now();
      if (!started.has(p.stage)) started.set(p.stage, now);
      const elapsed = (now - started.get(p.stage)!) / 1000;
      const fraction = p.total > 0 ? p.done / p.total : 1;
      const rate = elapsed > 0 ? p.done / elapsed : 0;
      const eta = rate > 0 ? (p.total - p.done) / rate : 0;
      const rateText = `${(rate / 1e6).toFixed(1)} M/s`;
      if (tty) {
        const width = 24;
        const filled = Math.round(fraction * width);
        const bar = `${'#'.repeat(filled)}${'.'.repeat(width - filled)}`;
        const text = `${options.label} ${p.stage.padEnd(10)} [${colour ? `\x1b[32m${bar}\x1b[0m` : bar}] ${(fraction * 100).toFixed(0).padStart(3)}% ${rateText} ETA ${eta.toFixed(1)}s`;
        stream.write(`\r\x1b[2K${text}`);
        drawn = true;
      } else if (now - lastPlain > 2000 || (p.done === p.total && elapsed > 1)) {
        // Plain lines: at most every 2 s, plus the end of any stage that took over a second.
        lastPlain = now;
        stream.write(`${options.label} ${p.stage}: ${(fraction * 100).toFixed(0)}% (${rateText}, ETA ${eta.toFixed(1)}s)\n`);
      }
    },
    log(line: string): void {
      clear();
      stream.write(`${line}\n`);
    },
    done(): void {
      clear();
    },
  };
}
