/**
 * What a run records of its heaters (physics/heater.ts, time/plates.ts): the ledger's heater channel (electric heat
 * into the plate, J/m² of footprint) and the plate's stored heat, the time a heater was under the stack and the heat
 * it could have given in that time at full power (the duty cycle is their ratio), and for each recorded row the power
 * during the step that ended there (W) and the plate temperature (K; NaN while no heater is under the stack: a plate
 * that has been lifted off is not followed).
 */
import type { StepObservation } from '../physics/observation.ts';
import type { Problem } from '../physics/problem.ts';

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

export function createHeaterRecorder() {
  const ledger = { heaterJ: 0, plateStoredJ: 0 };
  let attachedS = 0;
  let fullPowerJ = 0;
  let plateMaxK = -Infinity;
  /** The values for the latest row: power W, plate K. */
  const latest = { powerW: 0, plateK: NaN };

  function onStep(obs: StepObservation): void {
    latest.powerW = 0;
    latest.plateK = NaN;
    const dt = obs.t1 - obs.t0;
    for (const side of [0, 1] as const) {
      const c = (side === 0 ? obs.bottom : obs.top).condition;
      if (c.kind !== 'heater') continue;
      // on the initial report (dt = 0) the channel holds no heat, the power about to be applied and the starting plate
      const p = obs.energy.plates[side];
      ledger.heaterJ += p.heaterJ;
      ledger.plateStoredJ += p.storedJ;
      attachedS += dt;
      fullPowerJ += dt * c.heater.powerWPerM2;
      latest.powerW += p.powerW;
      latest.plateK = p.plateK;
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
