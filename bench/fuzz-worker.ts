/**
 * The worker thread of `npm run fuzz`: checks one scenario against the fuzz properties (tests/fuzz/check.ts) and
 * reports the outcome with the heap in use afterwards. Run by tinypool, which ends the thread on a timeout.
 */
import { checkScenario, type FuzzOutcome } from '../tests/fuzz/check.ts';
import type { ScenarioFile } from '../sim/scenario/scenario-schema.ts';

export interface FuzzTask { readonly index: number; readonly scenario: ScenarioFile }
export interface FuzzReply { readonly index: number; readonly outcome: FuzzOutcome; readonly heapMb: number }

export default function fuzzTask(task: FuzzTask): FuzzReply {
  let outcome: FuzzOutcome;
  try {
    outcome = checkScenario(task.scenario);
  } catch (e) {
    outcome = { kind: 'violation', message: `threw: ${(e as Error).message}`, ms: 0, cells: 0, steps: 0 };
  }
  return { index: task.index, outcome, heapMb: process.memoryUsage().heapUsed / 2 ** 20 };
}
