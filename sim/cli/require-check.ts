/**
 * `run --require "EXPR"` (repeatable): conditions a batch script puts on a run's verdicts, in the target notation of
 * sim/study/target.ts (`safe_window_s>=60`, `margin_K>=25`, `layers.anode.margin_K>=25`). Each is checked against
 * the scenario's layers before the run (a bad one exits 2 without running), then reported after the run with
 * met/NOT MET and the value read; one not met makes `run` exit 3 (CheckFailed). A verdict that does not exist (null)
 * does not meet any requirement.
 */
import type { Problem } from '../physics/problem.ts';
import { checkTarget, evaluateTarget, parseTarget, readingText, type Target } from '../study/target.ts';
import type { Summary } from '../observe/verdict.ts';
import { expectationWords } from '../observe/wording.ts';
import { InputError } from './input.ts';

export const collectRequirement = (value: string, previous: string[]): string[] => [...previous, value];

/** The requirements, checked against the scenario's layer ids; the first bad one is refused (exit 2). */
export function parseRequirements(exprs: readonly string[], problem: Problem): Target[] {
  const ids = problem.layers.map((l) => l.id);
  return exprs.map((e) => {
    const t = parseTarget(e);
    if (!t.ok) throw new InputError(`--require: ${t.message}`);
    const bad = checkTarget(t.value, ids);
    if (bad) throw new InputError(`--require: ${bad}`);
    return t.value;
  });
}

/**
 * Writes one line per requirement (`write`: stdout for the table, stderr beside --json) and returns the messages of
 * those not met, for CheckFailed.
 */
export function reportRequirements(targets: readonly Target[], summary: Summary, file: string, write: (s: string) => void): string[] {
  const failed: string[] = [];
  for (const t of targets) {
    const check = evaluateTarget(t, summary);
    const word = check.met ? expectationWords.pass : expectationWords.fail;
    write(`  requirement ${t.text}: ${word} (${t.pathText} = ${readingText(check.value)})\n`);
    if (!check.met) failed.push(`${file}: requirement not met: ${t.text}; the run gave ${t.pathText} = ${readingText(check.value)}`);
  }
  return failed;
}
