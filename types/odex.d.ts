// Local declaration for odex 2.0.4, which ships TypeScript sources but no .d.ts (see DEVELOPERS.md).
declare module 'odex' {
  export enum Outcome { Converged = 0, MaxStepsExceeded = 1, EarlyReturn = 2 }
  export type Derivative = (x: number, y: number[]) => number[];
  export type OutputFunction = (
    nr: number, xold: number, x: number, y: number[], dense?: (c: number, x: number) => number,
  ) => boolean | void;
  export class Solver {
    constructor(n: number);
    relativeTolerance: number | number[];
    absoluteTolerance: number | number[];
    maxSteps: number;
    initialStepSize: number;
    maxStepSize: number;
    denseOutput: boolean;
    solve(f: Derivative, x: number, y0: number[], xEnd: number, solOut?: OutputFunction): {
      y: number[]; outcome: Outcome; nStep: number; xEnd: number; nAccept: number; nReject: number; nEval: number;
    };
  }
}
