/**
 * Imported first by main.ts, for its side effect: modules run in import order, so the solver worker's thread starts
 * before the rest of the page's modules (the schema, the material library) are evaluated.
 */
import { startEarly } from './solver-worker.ts';

startEarly();
