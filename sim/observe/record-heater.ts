/**
 * What a run records of its heaters (physics/heater.ts, time/plates.ts): the ledger's heater channel (electric heat
 * into the plate, J/m² of footprint) and the plate's stored heat, the time a heater was under the stack and the heat
 * it could have given in that time at full power (the duty cycle is their ratio), and for each recorded row the power
 * during the step that ended there (W) and the plate temperature (K; NaN while no heater is under the stack: a plate
 * that has been lifted off is not followed). A thermostat held in its band (time/plates.ts) is a warning: when it began
 * and for how long.
 */
import type { StepObservation } from '../physics/observation.ts';
import type { Problem } from '../physics/problem.ts';
import { heldThermostatDefaults } from '../physics/heater.ts';

export interface HeaterRecord {
  /** Power (W) and plate temperature (°C; NaN where no heater is under the stack), one per recorded row. */
  readonly powerW: Float64Array;
  readonly plateC: Float64Array;
  /** Time a heater was under the stack, s, and the heat it would have given there at full power, J/m². */
  readonly attachedS: number;
  readonly fullPowerJ: number;
  /** Highest plate temperature reached, K (−∞ if none). */
  readonly plateMaxK: number;
  /**
   * Time a thermostat was held in its band, s, the start of the first step so held (NaN: never), and the window of
   * switches of the rule that began that hold, s (heldThermostatDefaults heldWithinS or heldQuietWithinS).
   */
  readonly heldS: number;
  readonly heldFromS: number;
  readonly heldWithinS: number;
}

/** The warning for a thermostat held in its band (time/plates.ts; physics/heater.ts heldThermostatDefaults), or undefined when none was. */
export function heldWarning(r: HeaterRecord): string | undefined {
  if (!(r.heldS > 0)) return undefined;
  const g = heldThermostatDefaults;
  const why = r.heldWithinS === g.heldQuietWithinS
    ? `its ripple in the stack under ${g.heldRippleShare} × tolerance_K` : 'too fast to follow one switch at a time';
  return `the heater's thermostat switched ${g.heldSwitches} times within ${r.heldWithinS} s by t = ${Number(r.heldFromS.toPrecision(4))} s, ` +
    `${why}: for ${Number(r.heldS.toPrecision(3))} s of the run its plate was held in the middle of its band, ` +
    'at the mean power of the switching (a wider band_K or a heavier plate shows each switch)';
}

/** Whether any face segment of the problem is a heater. */
export const hasHeater = (problem: Problem): boolean =>
  [...problem.bottom, ...problem.top].some((s) => s.condition.kind === 'heater');

export function createHeaterRecorder() {
  const ledger = { heaterJ: 0, plateStoredJ: 0 };
  let attachedS = 0;
  let fullPowerJ = 0;
  let plateMaxK = -Infinity;
  let heldS = 0;
  let heldFromS = NaN;
  let heldWithinS = NaN;
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
      if (p.held) {
        heldS += dt;
        if (Number.isNaN(heldFromS)) { heldFromS = obs.t0; heldWithinS = p.heldWithinS; }
      }
      plateMaxK = Math.max(plateMaxK, latest.plateK);
    }
  }

  return {
    ledger,
    latest,
    onStep,
    finish: (powerW: Float64Array, plateC: Float64Array): HeaterRecord => ({ powerW, plateC, attachedS, fullPowerJ, plateMaxK, heldS, heldFromS, heldWithinS }),
  };
}
