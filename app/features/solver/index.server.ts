// What other features use of the solver API.
export { SOLVE_LAYOUTS } from "./solve.server";
