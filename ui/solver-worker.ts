/**
 * Where solver workers come from. The page starts one before the rest of its modules are evaluated
 * (starting a worker thread takes a while), and the runner takes that one for its first run.
 */
let early: Worker | undefined;

export function spawnSolver(): Worker {
  return new Worker(new URL('./worker.ts', import.meta.url), { type: 'module', name: 'freezeline-solver' });
}

/** Starts the first worker now (early-solver.ts). */
export function startEarly(): void {
  early ??= spawnSolver();
}

/** The worker started early, once; afterwards a new one. */
export function takeSolver(): Worker {
  const w = early ?? spawnSolver();
  early = undefined;
  return w;
}
