// What other features use of the solver API.
export { SOLVE_LAYOUTS } from "./solve.server";
export { MAX_ANSWER_FLAGS, MAX_ANSWER_LEG_FRAMES, MAX_SOLVE_LEG_FRAMES } from "./limits";
