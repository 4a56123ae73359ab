/**
 * `run --coefficients`: the coefficient trace (sim/observe/coefficients.ts) as terminal text, one block per
 * coefficient: what it is and its value on one line, its source indented below (sources run long: a library file's
 * source text names its papers and the arithmetic done on them).
 */
import { coefficientTrace } from '../observe/coefficients.ts';
import type { Problem } from '../physics/problem.ts';

export function coefficientTable(problem: Problem): string {
  const lines = ['Every coefficient the solver used, and where it comes from:', ''];
  for (const c of coefficientTrace(problem)) {
    lines.push(`  ${c.what}: ${c.value}`);
    lines.push(`      source: ${c.source}`);
  }
  return lines.join('\n');
}
