import { createRequire } from "node:module";

/** The part of the odex solver (Hairer & Wanner's ODEX, extrapolated midpoint rule) we use. */
export interface OdexSolver {
  relativeTolerance: number;
  absoluteTolerance: number;
  denseOutput: boolean;
  maxSteps: number;
  initialStepSize: number;
  solve(
    f: (x: number, y: number[]) => number[],
    x0: number,
    y0: number[],
    xEnd: number,
    solOut?: (n: number, xOld: number, x: number, y: number[], dense?: (component: number, x: number) => number) => boolean | void,
  ): { y: number[]; outcome: number; nStep: number; nAccept: number; nReject: number; nEval: number };
}

/** odex's outcome codes. */
export const ODEX_OUTCOME = { converged: 0, maxStepsExceeded: 1, earlyReturn: 2 } as const;

let odexModule: { Solver: new (n: number) => OdexSolver } | undefined;

/**
 * A new odex solver for an n-dimensional system. odex ships TypeScript source without
 * declarations, so a plain import would make tsc type-check its source; it is loaded through
 * `createRequire` and typed here with the few members we use.
 * Note: odex never starts with a step below 1e-4 of the independent variable; callers scale time
 * so that the problem's time scale is about 1.
 * Source: E. Hairer, S. P. Nørsett, G. Wanner, Solving Ordinary Differential Equations I, 2nd ed.
 * (Springer 1993), §II.9 (extrapolation methods, code ODEX) and §II.6 (dense output) (section numbers from
 * memory).
 * Cost: one module load per process.
 */
export function createOdexSolver(n: number): OdexSolver {
  if (odexModule === undefined) {
    const require = createRequire(import.meta.url);
    odexModule = require("odex") as { Solver: new (n: number) => OdexSolver };
  }
  return new odexModule.Solver(n);
}
