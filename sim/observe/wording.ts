/**
 * The one vocabulary of freezeline: one term and one definition per idea, read by the CLI table, the HTML report,
 * the browser view and the README's verdict table (a test keeps the README in step with this file). Plain data:
 * no DOM, no Node, no formatting of numbers (that is sim/observe/format.ts).
 *
 * Choices made once, with the reason:
 *   - "heat off" (not "heater removed"): the heat may come from a plate, a held face, a flux or a source inside the
 *     stack; "heat off" fits all of them.
 *   - "usable window" (not "safe window"): "safe" reads as a safety claim, which a model's prediction never is. The
 *     result document keeps its key `safe_window_s` (the file contract); only the words change.
 *   - "cells" (not "nodes"): the stack is cut into finite-volume cells; the face points are "faces".
 *   - A quantity with no value reads as words ("never fully molten"), never as a number with a unit.
 */
import type { WindowStatus } from './verdict.ts';

/** A term as shown to a person, and its definition (one sentence or two, plain words). */
export interface Term {
  readonly term: string;
  readonly definition: string;
}

/** The verdicts of a run, keyed by their name in the result document. Order = order of the README table. */
export const verdictTerms = {
  heat_off_s: {
    term: 'heat off at',
    definition: 'End of the last heat input: a held plate, a held face temperature, a positive flux or heater power, a positive volumetric source. 0 if there is none; no value if one lasts to the end of the run.',
  },
  molten_at_s: {
    term: 'separator molten at',
    definition: 'First time every cell of the separator is fully liquid.',
  },
  half_frozen_at_s: {
    term: 'separator half-frozen at',
    definition: 'First time after heat off that the separator\'s volume-mean liquid fraction falls below 0.5.',
  },
  frozen_at_s: {
    term: 'separator frozen at',
    definition: 'First time after half-frozen that every cell of the separator is solid.',
  },
  peak_C: {
    term: 'peak',
    definition: 'The hottest point of the layer (its cells, and its exposed face if it has one) over the run, and the first time it came within 0.05 K of it: a layer held steady at its peak gives the time it got there, not a point along the plateau.',
  },
  margin_K: {
    term: 'margin',
    definition: 'Limit temperature minus peak temperature, for the layer\'s binding (smallest-margin) limit; zero or negative means the limit was reached.',
  },
  safe_window_s: {
    term: 'usable window',
    definition: 'From heat off to separator half-frozen, when the separator was fully molten at some time, it half-froze within the run and no layer reached any of its limits; otherwise no value, and the window status says why.',
  },
  energy: {
    term: 'energy balance',
    definition: 'Heat in and out through the faces and sources, change of stored enthalpy (sensible + latent), and the relative imbalance.',
  },
} as const satisfies Record<string, Term>;

/**
 * What each usable-window status means: a short label for a table cell, a sentence for a reader, and `at`, the same
 * fact as a clause about one run of a study (sim/study/window.ts), where `run` names that run ("this hold",
 * "this plate temperature"): "usable window after heat off at 14:20 min:s: none — <clause>".
 */
export const windowStatusWords: Readonly<Record<WindowStatus, {
  readonly label: string;
  readonly sentence: string;
  readonly at: (run: string) => string;
}>> = {
  'ok': { label: 'ok', sentence: 'From heat off to separator half-frozen, with no limit reached.',
    at: (run) => `usable from heat off to separator half-frozen at ${run}, with no limit reached` },
  'limit-crossed': { label: 'none: limit reached', sentence: 'No usable window: a layer reached one of its limits.',
    at: (run) => `a layer reaches one of its limits at ${run}` },
  'never-molten': { label: 'none: never fully molten', sentence: 'No usable window: the separator never became fully molten.',
    at: (run) => `the separator is not fully molten at ${run}` },
  'no-separator': { label: 'none: no separator', sentence: 'No usable window: no layer is marked as the separator.',
    at: () => 'no layer is marked as the separator' },
  'heat-never-off': { label: 'not known: heat never off', sentence: 'Not known: the heat stays on to the end of the run.',
    at: (run) => `the heat stays on to the end of the run at ${run}` },
  'still-molten-at-end': { label: 'at least to the end', sentence: 'At least until the end of the run: the separator had not half-frozen; lengthen the duration to measure it.',
    at: () => 'the separator is still at least half molten at the end of the run' },
};

/**
 * The words for a run that stopped before its end (a physical reason or the run-time ceiling), as the view shows the
 * part that ran: its window has no verdict, and an event it did not reach may lie past the stop, so it is never
 * "never".
 */
export const stoppedWords = {
  window: 'run stopped',
  notReached: 'not reached',
} as const;

/** Words for a verdict that has no value (null in the result document). */
export const noValueWords = {
  heat_off_s: 'heat stays on to the end',
  molten_at_s: 'never fully molten',
  half_frozen_at_s: 'not half-frozen at the end',
  frozen_at_s: 'not yet frozen at the end',
  margin_K: 'no limit',
  limit: 'none on file',
} as const;

/** Labels of a layer's state against its binding limit. */
export const marginWords = {
  binding: 'binding',
  bindingMeaning: 'the layer closest to its limit',
  reached: 'LIMIT REACHED',
  reachedSentence: (layer: string, kind: string): string => `${layer} reaches its ${kind} limit: not usable as predicted.`,
} as const;

/** Other words used on more than one screen. */
export const terms = {
  layer: { term: 'layer', definition: 'One material slab of the stack, numbered bottom to top.' },
  separator: { term: 'separator', definition: 'The porous layer that holds the salt; its liquid fraction decides the usable window.' },
  cell: { term: 'cell', definition: 'One finite volume of a layer: the solver\'s unit of space.' },
  liquidFraction: { term: 'liquid fraction', definition: 'Share of a cell (or the volume-mean share of a layer) that is molten, 0 to 1.' },
  ambient: { term: 'ambient', definition: 'The room air and surroundings the faces see after the heat is off.' },
  step: { term: 'step', definition: 'One solver time step.' },
} as const satisfies Record<string, Term>;

/** Outcome words of a stated expectation (sim/scenario/expect.ts). */
export const expectationWords = { pass: 'met', fail: 'NOT MET', unknown: 'not evaluated' } as const;

/** The short hazard list shown at the end of every run, in the report and in the view; shown as "term: definition". */
export const hazards: readonly Term[] = [
  { term: 'Molten salt', definition: 'Causes severe burns and splashes violently on contact with water or damp tools; keep water away.' },
  { term: 'Lithium salts', definition: 'LiCl and its eutectics are hygroscopic and corrosive; handle them dry and with protection.' },
  { term: 'Magnesium fires', definition: 'Burn extremely hot and react with water: use a class D extinguishing agent, never water or CO₂. Thin magnesium (ribbon, foil, powder) can ignite well below the bulk figure.' },
  { term: 'Hot surfaces', definition: 'Plates, cups and the cell stay hot long after the separator has frozen.' },
];

/** The sentence that closes every printout and the view's caution box. */
export const predictionNotCertification =
  'A prediction, not a safety certification: local codes, your lab\'s safety rules and licensed practice come first.';

/** Heading of the hazard list. */
export const hazardsHeading = 'Cautions';
