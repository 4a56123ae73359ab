// Worker entry when the CLI runs from its TypeScript source: Node 20 does not apply an `--import tsx` given in a
// worker's execArgv, so this registers tsx's loader in the worker itself and re-exports the task function of
// sweep-worker.ts. A bundled CLI ships sweep-worker.js instead and never loads this file.
import { register } from 'tsx/esm/api';

register();
const worker = await import('./sweep-worker.ts');
export default worker.default;
