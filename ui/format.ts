/**
 * The view's number formatting is the solver's one formatting module (sim/observe/format.ts), so the page, the CLI, the CSV
 * and the report print every number the same way. Import from here or from sim/observe/format.ts directly.
 */
export * from '../sim/index.ts';
