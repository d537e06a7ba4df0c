// The part of numeric 1.2.6 (which ships no types) that the tests use.
declare module "numeric" {
  type UncminResult = {
    solution: number[];
    f: number;
    gradient: number[];
    invHessian: number[][];
    iterations: number;
    message: string;
  };
  const numeric: {
    uncmin(objective: (x: number[]) => number, x0: number[], tol?: number, gradient?: (x: number[]) => number[], maxit?: number): UncminResult;
  };
  export default numeric;
}
