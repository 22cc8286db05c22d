// Minimal typings for the untyped `fmin` package (Ben Frederickson's minimisers).
// fmin 0.0.4 ships a UMD bundle under "type": "module": import it through
// src/numerics/fminNelderMead.ts, which resolves the real export at run time.
declare module 'fmin' {
  export interface FminParams {
    maxIterations?: number;
    nonZeroDelta?: number;
    zeroDelta?: number;
    minErrorDelta?: number;
    minTolerance?: number;
    rho?: number;
    chi?: number;
    psi?: number;
    sigma?: number;
    history?: unknown[];
  }
  export interface FminResult {
    fx: number;
    x: number[];
    id?: number;
  }
  export function nelderMead(f: (x: number[]) => number, x0: number[], parameters?: FminParams): FminResult;
  export function conjugateGradient(
    f: (x: number[], fxprime: number[]) => number,
    x0: number[],
    parameters?: FminParams & { learnRate?: number },
  ): FminResult & { fxprime: number[] };
  export function gradientDescent(
    f: (x: number[], fxprime: number[]) => number,
    x0: number[],
    parameters?: FminParams & { learnRate?: number },
  ): FminResult & { fxprime: number[] };
  export function gradientDescentLineSearch(
    f: (x: number[], fxprime: number[]) => number,
    x0: number[],
    parameters?: FminParams & { learnRate?: number; c1?: number; c2?: number },
  ): FminResult & { fxprime: number[] };
  export function bisect(f: (x: number) => number, a: number, b: number, parameters?: { maxIterations?: number; tolerance?: number }): number;
}
