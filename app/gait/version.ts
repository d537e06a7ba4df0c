/**
 * The gait engine's version as written into tables and release records. The
 * engine has no version of its own yet: bump this whenever solveSequence could
 * give other angles for the same sequence and robot.
 */
export const SOLVER_VERSION = "1.0.0";
