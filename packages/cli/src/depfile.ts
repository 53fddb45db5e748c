/**
 * Make-syntax dependency files for build systems (`--depfile`): one rule, every artifact written as a
 * target and every file read as a prerequisite, so Make (`-include`) and Ninja (`depfile`, `deps = gcc`)
 * rerun a bake when any input, recipe or batch file changes. Escaping follows GNU Make's rules as Ninja's
 * depfile parser reads them: a space, '#' and a backslash before them are escaped with a backslash, '$' is
 * written '$$' (GNU Make manual, "Rule Syntax" and "Using Variables"; Ninja manual, "depfile").
 */

export function escapeMakePath(path: string): string {
  let out = '';
  for (let i = 0; i < path.length; i++) {
    const c = path[i]!;
    if (c === '$') out += '$$';
    else if (c === ' ' || c === '#') {
      // Backslashes directly before an escaped character are doubled too.
      let j = out.length - 1;
      let n = 0;
      while (j >= 0 && out[j] === '\\') { n++; j--; }
      out += '\\'.repeat(n) + '\\' + c;
    } else if (c === '\n' || c === '\r') throw new Error(`a path with a line break cannot be written to a depfile: ${JSON.stringify(path)}`);
    else out += c;
  }
  return out;
}

/** The depfile text: "t1 t2 ...: p1 p2 ..." with line continuations, one path per line. */
export function depfileText(targets: readonly string[], prerequisites: readonly string[]): string {
  const uniq = (list: readonly string[]): string[] => [...new Set(list)];
  const t = uniq(targets).map(escapeMakePath);
  const p = uniq(prerequisites).map(escapeMakePath);
  return `${t.join(' \\\n')}: ${p.length === 0 ? '' : `\\\n  ${p.join(' \\\n  ')}`}\n`;
}
