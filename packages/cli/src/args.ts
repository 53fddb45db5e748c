/** A small, strict argument parser: --flag, --flag value, --flag=value, --no-flag; unknown flags are errors. */

export class UsageError extends Error {
  readonly command: string;
  constructor(command: string, message: string) {
    super(message);
    this.name = 'UsageError';
    this.command = command;
  }
}

export interface FlagSpec {
  readonly type: 'string' | 'number' | 'boolean';
  /** Allowed multiple times (values collected in order). */
  readonly repeat?: boolean;
}

export interface ParsedArgs {
  readonly positionals: string[];
  readonly flags: Record<string, string | number | boolean | (string | number)[]>;
}

export function parseArgs(command: string, argv: readonly string[], spec: Readonly<Record<string, FlagSpec>>): ParsedArgs {
  const positionals: string[] = [];
  const flags: ParsedArgs['flags'] = {};
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg === '--') {
      positionals.push(...argv.slice(i + 1));
      break;
    }
    if (!arg.startsWith('--') || arg === '--') {
      if (arg.startsWith('-') && arg.length > 1 && arg !== '-') throw new UsageError(command, `unknown option ${arg}`);
      positionals.push(arg);
      continue;
    }
    let name = arg.slice(2);
    let value: string | undefined;
    const eq = name.indexOf('=');
    if (eq >= 0) {
      value = name.slice(eq + 1);
      name = name.slice(0, eq);
    }
    let s = spec[name];
    let negated = false;
    if (s === undefined && name.startsWith('no-') && spec[name.slice(3)]?.type === 'boolean') {
      s = spec[name.slice(3)];
      name = name.slice(3);
      negated = true;
    }
    if (s === undefined) throw new UsageError(command, `unknown option --${name}`);
    if (s.type === 'boolean') {
      if (value !== undefined) throw new UsageError(command, `option --${name} takes no value`);
      flags[name] = !negated;
      continue;
    }
    if (negated) throw new UsageError(command, `unknown option --no-${name}`);
    if (value === undefined) {
      value = argv[++i];
      if (value === undefined) throw new UsageError(command, `option --${name} needs a value`);
    }
    let parsed: string | number = value;
    if (s.type === 'number') {
      parsed = Number(value);
      if (value.trim() === '' || !Number.isFinite(parsed)) throw new UsageError(command, `option --${name} needs a number, got "${value}"`);
    }
    if (s.repeat) {
      const list = (flags[name] as (string | number)[] | undefined) ?? [];
      list.push(parsed);
      flags[name] = list;
    } else {
      flags[name] = parsed;
    }
  }
  return { positionals, flags };
}
