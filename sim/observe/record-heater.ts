/**
 * What a run records of its heaters (physics/heater.ts, time/plates.ts): the ledger's heater channel (electric heat
 * into the plate, J/m² of footprint) and the plate's stored heat, the time a heater was under the stack and the heat
 * it could have given in that time at full power (the duty cycle is their ratio), and for each recorded row the power
 * during the step that ended there (W) and the plate temperature (K; NaN while no heater is under the stack: a plate
 * that has been lifted off is not followed).
 */
import type { FaceCondition, Problem } from '../physics/problem.ts';
import type { StepReport } from '../time/evolve.ts';

export interface HeaterRecord {
  /** Power (W) and plate temperature (°C; NaN where no heater is under the stack), one per recorded row. */
  readonly powerW: Float64Array;
  readonly plateC: Float64Array;
  /** Time a heater was under the stack, s, and the heat it would have given there at full power, J/m². */
  readonly attachedS: number;
  readonly fullPowerJ: number;
  /** Highest plate temperature reached, K (−∞ if none). */
  readonly plateMaxK: number;
}

/** Whether any face segment of the problem is a heater. */
export const hasHeater = (problem: Problem): boolean =>
  [...problem.bottom, ...problem.top].some((s) => s.condition.kind === 'heater');

const sideOf = (step: StepReport, side: 0 | 1): FaceCondition => (side === 0 ? step.cond.bottom : step.cond.top);

export function createHeaterRecorder() {
  const ledger = { heaterJ: 0, plateStoredJ: 0 };
  let attachedS = 0;
  let fullPowerJ = 0;
  let plateMaxK = -Infinity;
  /** The values for the latest row: power W, plate K. */
  const latest = { powerW: 0, plateK: NaN };

  function onStep(step: StepReport): void {
    latest.powerW = 0;
    latest.plateK = NaN;
    for (const side of [0, 1] as const) {
      const c = sideOf(step, side);
      if (c.kind !== 'heater') continue;
      const node = step.ws.plates[side];
      if (step.t1 === 0) {
        // the initial state: the plate as it starts, the power about to be applied
        latest.powerW += node.powerWPerM2 * c.heater.areaM2;
        latest.plateK = node.tK;
      } else {
        const p = step.plates[side];
        const dt = step.t1 - step.t0;
        ledger.heaterJ += p.heaterJ;
        ledger.plateStoredJ += p.storedJ;
        attachedS += dt;
        fullPowerJ += dt * c.heater.powerWPerM2;
        latest.powerW += p.powerW;
        latest.plateK = p.plateK;
      }
      plateMaxK = Math.max(plateMaxK, latest.plateK);
    }
  }

  return {
    ledger,
    latest,
    onStep,
    finish: (powerW: Float64Array, plateC: Float64Array): HeaterRecord => ({ powerW, plateC, attachedS, fullPowerJ, plateMaxK }),
  };
}
