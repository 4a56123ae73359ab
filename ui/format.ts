/**
 * The view's number formatting is the solver's one formatting module (sim/format.ts), so the page, the CLI, the CSV
 * and the report print every number the same way. Import from here or from sim/format.ts directly.
 */
export * from '../sim/format.ts';
