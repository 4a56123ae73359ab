/**
 * Reading a scenario file for a command: the file's text → Problem, or an InputError whose message names the file,
 * the field and the value (exit code 2). Shared by every command so they refuse bad input in the same words.
 */
import { readFileSync } from 'node:fs';
import { formatFieldError } from '../scenario/field-errors.ts';
import type { Problem } from '../physics/problem.ts';
import type { RunRecord } from '../observe/record.ts';
import type { StopReason } from '../time/drive.ts';
import { runProblem, stopSentence } from '../run.ts';
import { parseScenarioText } from '../scenario/scenario.ts';
import type { ScenarioFile } from '../scenario/scenario-schema.ts';

/** A caller error: printed as it is, exit code 2. */
export class InputError extends Error {}

/**
 * 3: the run finished, but a stated expectation (`expect` block) or a `--require` condition failed. 4: a run stopped
 * before its end, for a physical reason (heat drawn beyond what the stack holds) or at the run-time ceiling; the
 * message says which and what to change. 1 stays for a failure of the program itself.
 */
export const EXIT = { ok: 0, internal: 1, invalid: 2, failedCheck: 3, stopped: 4 } as const;

/**
 * A run stopped before its end for a physical reason or at the run-time ceiling (run.ts stopSentence): not a failure
 * of the program. Printed as it is, exit code EXIT.stopped (4).
 */
export class RunStopped extends Error {
  /** `record`: what the run recorded up to its last accepted step (none from a study, whose runs keep nothing). */
  constructor(message: string, readonly reason: Exclude<StopReason, 'numerical'>, readonly tS: number, readonly detail: string,
    readonly record?: RunRecord) {
    super(message);
  }
}

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

/**
 * One full run of the scenario in `file`. A physical stop or the run-time ceiling throws RunStopped (exit 4); a
 * numerical stop or a cancellation is an internal error (exit 1).
 */
export function runOrFail(problem: Problem, file: string) {
  const out = runProblem(problem);
  if (out.status === 'cancelled') throw new Error('the run was cancelled');
  if (out.status === 'failed') {
    if (out.reason === 'numerical') throw new Error(stopSentence(out));
    throw new RunStopped(`${file}: ${stopSentence(out)}`, out.reason, out.tS, out.message, out.record);
  }
  return out;
}
