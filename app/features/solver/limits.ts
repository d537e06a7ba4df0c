// How much one solve request may ask for, so that no request takes a worker
// for long or builds an answer of hundreds of megabytes: counted in
// leg-frames (frames × legs), what both the solve time and the answer size
// grow with. Sizes from `npm run bench` figures on the demo hexapod.
import type { SolveLayout } from "../../workers/core-tasks";

/** Leg-frames one request may solve: 100 000 frames of a hexapod, about a second of one core. */
export const MAX_SOLVE_LEG_FRAMES = 600_000;

/**
 * Leg-frames an answer may carry, per layout: about 20 MB of frame objects
 * (10 000 frames of a hexapod, some 330 bytes a leg-frame) or of base64
 * columns (50 000 frames, some 57 bytes a leg-frame); the checks layout
 * carries no frames, so only the solve limit bounds it.
 */
export const MAX_ANSWER_LEG_FRAMES: Record<SolveLayout, number> = { frames: 60_000, columns: 300_000, checks: MAX_SOLVE_LEG_FRAMES };

/** Flags an answer may carry (about 16 MB): their number is not bounded by the frames alone, at worst every check of every joint every frame. */
export const MAX_ANSWER_FLAGS = 100_000;
