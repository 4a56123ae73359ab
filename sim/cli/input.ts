/**
 * Reading a scenario file for a command: the file's text → Problem, or an InputError whose message names the file,
 * the field and the value (exit code 2). Shared by every command so they refuse bad input in the same words.
 */
import { readFileSync } from 'node:fs';
import { formatFieldError } from '../scenario/field-errors.ts';
import type { Problem } from '../physics/problem.ts';
import { runProblem } from '../run.ts';
import { parseScenarioText } from '../scenario/scenario.ts';
import type { ScenarioFile } from '../scenario/scenario-schema.ts';

/** A caller error: printed as it is, exit code 2. */
export class InputError extends Error {}

/** 3: the run finished, but a stated expectation (`expect` block) or a `--require` condition failed. */
export const EXIT = { ok: 0, internal: 1, invalid: 2, failedCheck: 3 } as const;

export function readText(file: string): string {
  try {
    return readFileSync(file, 'utf8');
  } catch (e) {
    throw new InputError(`${file}: cannot read the file (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
}

export function readProblem(file: string): Problem {
  return readScenario(file).problem;
}

/** The file as written (for its `expect` block and other keys the solver does not see) and as the solver's Problem. */
export function readScenario(file: string): { readonly scenario: ScenarioFile; readonly problem: Problem } {
  const parsed = parseScenarioText(readText(file));
  if (!parsed.ok) throw new InputError(parsed.errors.map((e) => `${file}: ${formatFieldError(e)}`).join('\n'));
  return parsed;
}

/**
 * The command ran and printed its output, but a stated expectation or a `--require` condition failed: the message
 * (one line per failure) goes to stderr and the exit code is EXIT.failedCheck (3).
 */
export class CheckFailed extends Error {}

/** One full run; a solver failure or cancellation is an internal error (exit 1). */
export function runOrFail(problem: Problem) {
  const out = runProblem(problem);
  if (out.status !== 'ok') throw new Error(out.status === 'failed' ? `the run failed at t = ${out.tS} s: ${out.message}` : 'the run was cancelled');
  return out;
}
