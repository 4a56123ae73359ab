/**
 * The public API of the computational core: what ui/ imports (an ESLint rule holds it to this file), and the entry a
 * newcomer reads first. The folders below name the parts, lowest first (DEVELOPERS.md "Layout" has the import rules):
 *   physics/   materials, faces, convection, air, salts, the Problem the solver sees
 *   grid/      the 1D stack of finite volumes and its operator (residual, Jacobian)
 *   time/      TR-BDF2, step control, breakpoints, the time loop
 *   observe/   what a run records, verdicts, the result document, the words and number formats
 *   scenario/  the file contract: schema, strict JSON, field errors, limits, reading a file into a Problem
 *   lumped/    the one-node-per-layer network, an independent check
 *   study/     window search, sweeps, goal seeking, ambient study
 */
export * from './run.ts';
export type { StopReason } from './time/drive.ts';
export * from './scenario/scenario.ts';
export * from './scenario/field-errors.ts';
export * from './scenario/json-text.ts';
export * from './scenario/library.ts';
export * from './scenario/scenario-limits.ts';
export * from './scenario/scenario-schema.ts';
export { inlineMaterial } from './scenario/material-kinds.ts';
export type { Material, Melt, Table } from './physics/material.ts';
export { liquidusModel } from './physics/salt.ts';
export { kToC } from './physics/units.ts';
export * from './physics/problem.ts';
export * from './observe/record.ts';
export * from './observe/verdict.ts';
export * from './observe/wording.ts';
export * from './observe/format.ts';
export * from './observe/series-csv.ts';
export { layerColours } from './observe/layer-colours.ts';
export * from './study/bracket.ts';
export * from './study/sweep.ts';
export * from './study/target.ts';
export * from './study/window.ts';
export { holdKnob } from './study/knob.ts';
export { accuracyLine, accuracyPlan } from './scenario/accuracy.ts';
export * from './study/words.ts';
