/** `lightkiln inspect`: readable summaries of any file we read or write. */

import { readFileSync } from 'node:fs';
import { inspectBytes, LightkilnError, type FileSummary } from '@lightkiln/bake';
import { parseArgs, UsageError } from '../args.js';
import { EXIT_OK, printJson, type CommandContext } from '../io.js';

const SPEC = { json: { type: 'boolean' }, quiet: { type: 'boolean' }, help: { type: 'boolean' } } as const;

function fmt(value: unknown): string {
  if (typeof value === 'number') return Number.isInteger(value) ? String(value) : value.toPrecision(6);
  if (Array.isArray(value) && value.every((v) => typeof v === 'number')) return `[${value.map(fmt).join(', ')}]`;
  if (typeof value === 'object' && value !== null) return JSON.stringify(value);
  return String(value);
}

function render(summary: FileSummary): string {
  const lines = [`${summary.file}: ${summary.format}, ${summary.byteLength} bytes`];
  for (const [key, value] of Object.entries(summary.details)) {
    if (Array.isArray(value) && value.length > 0 && typeof value[0] === 'object') {
      lines.push(`  ${key}:`);
      for (const item of value) lines.push(`    ${Object.entries(item as Record<string, unknown>).map(([k, v]) => `${k} ${fmt(v)}`).join(', ')}`);
    } else if (typeof value === 'object' && value !== null && !Array.isArray(value)) {
      lines.push(`  ${key}:`);
      for (const [k, v] of Object.entries(value as Record<string, unknown>)) lines.push(`    ${k}: ${fmt(v)}`);
    } else {
      lines.push(`  ${key}: ${fmt(value)}`);
    }
  }
  return `${lines.join('\n')}\n`;
}

export async function inspectCommand(argv: readonly string[], ctx: CommandContext): Promise<number> {
  const { positionals, flags } = parseArgs('inspect', argv, SPEC);
  if (flags.help === true) return -1;
  if (positionals.length === 0) throw new UsageError('inspect', 'give at least one file');
  const summaries: FileSummary[] = [];
  for (const file of positionals) {
    let bytes: Uint8Array;
    try {
      bytes = readFileSync(file);
    } catch (error) {
      throw new LightkilnError('INVALID_INPUT', `${file}: cannot read (${(error as { code?: string }).code ?? 'error'})`, { file });
    }
    summaries.push(inspectBytes(bytes, file));
  }
  if (ctx.json) printJson(ctx, { files: summaries });
  else for (const s of summaries) ctx.stdout(render(s));
  return EXIT_OK;
}
