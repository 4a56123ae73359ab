/**
 * What a solver shows of each accepted step, whatever the solver: the samples of each layer with their weights, the
 * named faces, the named energy channels of the step, its times and whether a state event fired. The recorder, the
 * verdicts' inputs and the view read only this (observe/record.ts); the 1D grid's time loop fills it from its own
 * buffers (time/observe-step.ts), and the lumped network fills one per accepted step of its own (lumped/lumped.ts).
 *
 * Types in SI, and NO_PLATE (the empty plate channel of a producer without heaters). Why here: physics/ is the one
 * folder that every producer (grid/, time/, lumped/, a 2D grid to come) and every reader (observe/) may import under
 * the layering (eslint.config.js), and the observation names no solver concept (no node layout, no stage buffers, no
 * workspace): only layers, faces, materials and heat, which are physics/'s own words. A folder of its own would need a
 * layering rule for one file of types.
 *
 * A producer owns the arrays and may overwrite them at its next step: a reader copies what it keeps.
 */
import type { Material } from './material.ts';
import type { FaceCondition } from './problem.ts';

/** The fixed part of a layer's samples: what does not change from step to step. */
export interface LayerLayout {
  /** Index of the layer in Problem.layers, and its id. */
  readonly index: number;
  readonly id: string;
  /** Whether the layer is a separator: its samples locate the melt and freeze events (observe/record-trace.ts). */
  readonly separator: boolean;
  /** The material of every sample of the layer, with the producer's own enthalpy origin (the enthalpies read on it). */
  readonly material: Material;
  /** Each sample's weight, m: the thickness it stands for (a cell's width; the layer's for a lumped node). */
  readonly widthM: Float64Array;
  /** Each sample's position, m above the bottom face (a cell's centre; the layer's mid-plane for a lumped node). */
  readonly positionM: Float64Array;
}

/** The fixed part of every observation of a run: the layers bottom to top, and where the two faces are, m. */
export interface ObservationLayout {
  readonly layers: readonly LayerLayout[];
  readonly bottomM: number;
  readonly topM: number;
}

/** One layer's samples at the step's end (and its enthalpies at the stage time). */
export interface LayerSamples extends LayerLayout {
  /** Temperature of each sample at t1, K. */
  readonly temperatureK: Float64Array;
  /** Volumetric enthalpy of each sample at t1, J/m³ (on the material's own origin). */
  readonly enthalpy: Float64Array;
  /** The same at the stage time tStage, J/m³ (equal to `enthalpy` when the producer has no point inside its step). */
  readonly stageEnthalpy: Float64Array;
  /**
   * Net heat rate into each sample at t0 and at tStage under the step's conditions, W/m² of footprint (its dH/dt times
   * its width). The separator's melt and freeze events are located with them inside a step (observe/record-trace.ts);
   * a producer without them leaves them out, and the events are interpolated linearly between its points.
   */
  readonly startHeatRate?: Float64Array | undefined;
  readonly stageHeatRate?: Float64Array | undefined;
}

/** A named face at the step's end: its temperature, K, and the condition it was under during the step. */
export interface FaceSample {
  readonly temperatureK: number;
  readonly condition: FaceCondition;
}

/**
 * A heater plate behind a face over the step (physics/heater.ts). Read only while that face's condition is a heater.
 * On the zero-length initial report: no heat yet, the power about to be applied and the starting plate temperature.
 */
export interface PlateChannel {
  /** Electric heat into the plate, and the change of its stored heat, J/m² of footprint. */
  readonly heaterJ: number;
  readonly storedJ: number;
  /** Power during the step, W, and the plate temperature at its end, K. */
  readonly powerW: number;
  readonly plateK: number;
  /** Whether its thermostat was held in its band over the step, at the mean power of its switching (time/plates.ts). */
  readonly held: boolean;
  /** While held, the window of switches of the rule that began the hold, s (heldThermostatDefaults); NaN otherwise. */
  readonly heldWithinS: number;
}

/** The heat of the step by channel, J/m² (positive: into the stack). */
export interface EnergyChannels {
  /**
   * Through the bottom and top faces. On a heater face: minus the plate's loss to the surroundings (the plate is part
   * of the body whose ledger is kept, so its heat into the face is internal).
   */
  readonly bottomJ: number;
  readonly topJ: number;
  /** Generated inside the layers (volumetric sources and terms). */
  readonly generatedJ: number;
  /** Through the side walls (edge terms); 0 without them. */
  readonly edgesJ: number;
  /** The heater plate behind the bottom and the top face. */
  readonly plates: readonly [PlateChannel, PlateChannel];
}

export interface StepObservation {
  /** Start, stage point and end of the step, s. The run's starting state is reported as a step of zero length. */
  readonly t0: number;
  readonly tStage: number;
  readonly t1: number;
  /** Whether this is that zero-length report of the starting state. */
  readonly initial: boolean;
  /** Whether the step was landed on a state event that fired at t1 (a thermostat, the separator melting or freezing, a caller's switch). */
  readonly eventFired: boolean;
  /** The layers bottom to top, in Problem.layers order. */
  readonly layers: readonly LayerSamples[];
  readonly bottom: FaceSample;
  readonly top: FaceSample;
  readonly energy: EnergyChannels;
}

/** A plate channel with nothing in it (no heater behind the face). */
export const NO_PLATE: PlateChannel = { heaterJ: 0, storedJ: 0, powerW: 0, plateK: NaN, held: false, heldWithinS: NaN };
