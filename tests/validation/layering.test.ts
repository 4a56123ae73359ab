// The layering of sim/'s folders (DEVELOPERS.md, Layout; eslint.config.js): the lint refuses an import against the
// grain of each kind, and lets the allowed ones through. Checked with ESLint's own Node API (lintText lints a text as
// if it were the file at filePath, so nothing is written into the tree).
import { fileURLToPath } from 'node:url';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../../', import.meta.url));
const eslint = new ESLint({ cwd: root });

/** The no-restricted-imports messages ESLint gives `code` placed at `file` (a path under the project root). */
async function refusals(file: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: `${root}${file}` });
  return (result?.messages ?? []).filter((m) => m.ruleId === 'no-restricted-imports').map((m) => m.message);
}

describe('the import direction between sim/ folders', () => {
  it.each([
    ['sim/physics/probe.ts', "import { verdictTerms } from '../observe/wording.ts';", 'sim/physics/ imports no other folder'],
    ['sim/physics/probe.ts', "import { scenarioSchema } from '../scenario/scenario-schema.ts';", 'sim/physics/ imports no other folder'],
    ['sim/grid/probe.ts', "import { evolve } from '../time/evolve.ts';", 'sim/grid/ may import only sim/physics/'],
    ['sim/time/probe.ts', "import { createRecorder } from '../observe/record.ts';", 'sim/time/ may import only'],
    ['sim/lumped/probe.ts', "import { evolve } from '../time/evolve.ts';", 'sim/lumped/ may import only sim/physics/'],
    ['sim/observe/probe.ts', "import { parseScenario } from '../scenario/scenario.ts';", 'sim/observe/ may import only'],
    ['sim/observe/probe.ts', "import type { StepReport } from '../time/evolve.ts';", 'sim/observe/ may import only sim/grid/, sim/physics/'],
    ['sim/grid/probe.ts', "import { runProblem } from '../run.ts';", 'must not import the top of sim/'],
    ['sim/time/tr-bdf2.ts', "import { solveTridiagonal } from '../grid/tridiagonal.ts';", 'the integrator sees a system only through grid/stage-system.ts'],
    ['sim/time/drive.ts', "import { evaluate } from '../grid/discretization.ts';", 'the integrator sees a system only through grid/stage-system.ts'],
    ['sim/time/tr-bdf2.ts', "import { createRecorder } from '../observe/record.ts';", 'sim/time/ may import only'],
    ['sim/study/probe.ts', "import { program } from '../cli/main.ts';", 'sim/study/ must not import the CLI'],
    ['ui/probe.ts', "import { runProblem } from '../sim/run.ts';", 'only through sim/index.ts'],
  ])('refuses %s importing against the grain: %s', async (file, code, words) => {
    const messages = await refusals(file, `${code}\nexport {};\n`);
    expect(messages.join('\n')).toContain(words);
  });

  it.each([
    ['sim/grid/probe.ts', "import { buildMaterial } from '../physics/material.ts';"],
    ['sim/time/tr-bdf2.ts', "import type { StageSystem } from '../grid/stage-system.ts';"],
    ['sim/observe/probe.ts', "import type { StepObservation } from '../physics/observation.ts';"],
    ['sim/time/probe.ts', "import type { StepObservation } from '../physics/observation.ts';"],
    ['sim/lumped/probe.ts', "import type { StepObservation } from '../physics/observation.ts';"],
    ['sim/scenario/probe.ts', "import { formatTime } from '../observe/format.ts';"],
    ['sim/study/probe.ts', "import { runProblem } from '../run.ts';"],
    ['ui/probe.ts', "import { runProblem } from '../sim/index.ts';"],
  ])('lets %s import with the grain: %s', async (file, code) => {
    expect(await refusals(file, `${code}\nexport {};\n`)).toEqual([]);
  });
});
