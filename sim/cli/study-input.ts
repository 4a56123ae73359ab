/**
 * What the study commands (sweep, seek, ambient) share on the command line: reading the scenario as both a checked
 * Problem and its raw JSON (the paths address the file as written), the --jobs option, repeatable options, and
 * running an asynchronous command body so that its failures end with the same exit codes as the synchronous ones.
 */
import { EXIT, InputError, readProblem, readText, RunStopped } from './input.ts';
import type { Problem } from '../physics/problem.ts';
import type { Outcome } from '../study/scenario-path.ts';
import { defaultJobs } from './sweep-pool.ts';

export const collect = (value: string, previous: string[]): string[] => [...previous, value];

/** The scenario file, refused as `run` refuses it, and its JSON as written. */
export function readScenario(file: string): { problem: Problem; doc: unknown } {
  const problem = readProblem(file);
  return { problem, doc: JSON.parse(readText(file)) as unknown };
}

/** An Outcome's value, or an InputError (exit code 2) with its message. */
export function orRefuse<T>(o: Outcome<T>): T {
  if (!o.ok) throw new InputError(o.message);
  return o.value;
}

export function parseJobs(text: string | undefined): number {
  if (text === undefined) return defaultJobs();
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1) throw new InputError(`--jobs: must be a whole number ≥ 1, got ${JSON.stringify(text)}`);
  return n;
}

export function parseNumberOption(name: string, text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  const v = Number(text);
  if (text.trim() === '' || !Number.isFinite(v)) throw new InputError(`${name}: must be a number, got ${JSON.stringify(text)}`);
  return v;
}

/**
 * Starts the asynchronous part of a command once its input has been checked (synchronously, so bad input still
 * exits through main() with code 2). main() has already set the exit code to 0 by the time this settles; a failure
 * here replaces it.
 */
export function finishAsync(work: Promise<number | void>): void {
  work.then((code) => {
    if (typeof code === 'number' && code !== EXIT.ok) process.exitCode = code;
  }, (e: unknown) => {
    if (e instanceof InputError) { process.stderr.write(`${e.message}\n`); process.exitCode = EXIT.invalid; return; }
    if (e instanceof RunStopped) { process.stderr.write(`${e.message}\n`); process.exitCode = EXIT.stopped; return; }
    process.stderr.write(`freezeline: internal error: ${(e as Error).message}\n`);
    process.exitCode = EXIT.internal;
  });
}
