// The `freezeline` command as a user calls it: node sim/cli/bin.js in its own process, from the repository's root (the
// bin entry rebuilds a stale bundle first, then runs it). Shared by the tests that read what the command prints.
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The repository's root directory. */
export const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

/** Runs `freezeline …args`: its exit code, standard output and standard error. */
export function freezeline(...args: string[]): { code: number | null; out: string; err: string } {
  const r = spawnSync(process.execPath, [join(repoRoot, 'sim/cli/bin.js'), ...args], { cwd: repoRoot, encoding: 'utf8' });
  return { code: r.status, out: r.stdout, err: r.stderr };
}
