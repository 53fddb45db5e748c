/**
 * External reference tools (Debian packages installed by .ci/run). On a developer machine without them
 * the checks that need them are skipped; under CI (LIGHTKILN_REQUIRE_TOOLS=1) a missing tool fails.
 */

import { spawnSync, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export function hasTool(name: string): boolean {
  const found = spawnSync('sh', ['-c', `command -v ${name}`], { encoding: 'utf8' }).status === 0;
  if (!found && process.env.LIGHTKILN_REQUIRE_TOOLS === '1') {
    throw new Error(`reference tool "${name}" is required (LIGHTKILN_REQUIRE_TOOLS=1) but not installed`);
  }
  return found;
}

export function runTool(command: string, args: readonly string[]): { status: number; stdout: string; stderr: string } {
  const r = spawnSync(command, args, { encoding: 'utf8', timeout: 60_000 });
  return { status: r.status ?? -1, stdout: r.stdout ?? '', stderr: r.stderr ?? '' };
}

/** A temporary folder removed after `fn`. */
export function withTempDir<T>(fn: (dir: string) => T): T {
  const dir = mkdtempSync(join(tmpdir(), 'lightkiln-test-'));
  try {
    return fn(dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Stops a server we started, by its PID (SIGTERM), and waits for it to exit; no-op when it is gone. */
export async function stopChild(child: ChildProcess | null): Promise<void> {
  if (child === null || child.exitCode !== null || child.signalCode !== null) return;
  await new Promise<void>((resolve) => {
    child.once('exit', () => resolve());
    child.kill('SIGTERM');
  });
}
