// Bits returned by the hot-path solver: 0 means reachable and inside every limit.
// Bits, not an enum, because one target can be beyond reach and past a limit at once.

export const SOLVE_OK = 0;
/** The target is farther from the femur joint than femur + tibia. */
export const SOLVE_BEYOND_REACH = 1;
/** The target is nearer the femur joint than |femur − tibia|. */
export const SOLVE_INSIDE_FOLD = 2;
/** The target lies within 1 mm of the coxa axis, where the coxa angle is undefined. */
export const SOLVE_ON_COXA_AXIS = 4;
/** The target has a NaN or infinite coordinate. */
export const SOLVE_NOT_FINITE = 64;
/** The leg's own numbers lie outside the format's ranges (a definition that skipped parseRobot): no posture is solved. */
export const SOLVE_INVALID_LEG = 128;
export const SOLVE_UNREACHABLE = SOLVE_BEYOND_REACH | SOLVE_INSIDE_FOLD | SOLVE_ON_COXA_AXIS | SOLVE_NOT_FINITE | SOLVE_INVALID_LEG;
export const SOLVE_COXA_LIMIT = 8;
export const SOLVE_FEMUR_LIMIT = 16;
export const SOLVE_TIBIA_LIMIT = 32;
export const SOLVE_JOINT_LIMIT = SOLVE_COXA_LIMIT | SOLVE_FEMUR_LIMIT | SOLVE_TIBIA_LIMIT;

/** Distance from the coxa axis below which a target counts as on it (DESIGN.md). */
export const COXA_AXIS_CLEARANCE_MM = 1;
