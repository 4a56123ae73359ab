// Mirror symmetry: a stack A B … B A with mirrored contacts and the same conditions on both faces has a profile even
// about its mid-plane, T(x) = T(ℓ − x), at every time (the heat equation is invariant under x → ℓ − x; uniqueness of
// its solution, e.g. Carslaw & Jaeger, Conduction of Heat in Solids, 2nd ed., §1.7).

import { describe, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { randomSymmetricScenario, runOk, seededRandom } from '../support/scenarios.ts';

const SEEDS = Array.from({ length: 12 }, (_, i) => i + 1);

describe('mirror symmetry (random symmetric stacks)', () => {
  it.each(SEEDS)('runProblem() on symmetric random stack #%i gives T(x) = T(ℓ − x) at the probes and equal face temperatures', (seed) => {
    const { scenario, pairs } = randomSymmetricScenario(seededRandom(seed * 104729));
    const { record } = runOk(scenario);
    // The grid is mirror-symmetric (each layer's cells are graded symmetrically), so the discrete solution is too;
    // only the Newton stop (updates ≤ newtonShare·tolerance_K, then contracting fast) and round-off can break it. Tolerance 1e-6 K.
    // Measured: ≤ 2e-11 K.
    const tol = { abs: 1e-6 };
    pairs.forEach(([x, mirror], k) => {
      record.probes.tS.forEach((t, j) => {
        assertClose(record.probes.tC[2 * k + 1]![j]!, record.probes.tC[2 * k]![j]!, tol, `T(${mirror} mm) against T(${x} mm) at ${t} s`);
      });
    });
    record.bottomC.forEach((bottom, j) => assertClose(record.topC[j]!, bottom, tol, `top against bottom face at ${record.tS[j]} s`));
  });
});
