// What solveSequence returns (DESIGN.md, "Gait sequence"): frames, flags and a
// summary. Exporters and the UI consume these types; they are plain JSON.
import type { BodyPose, JointAngles, JointName, Vec3 } from "../kinematics/index";
import type { Contact } from "./sequence";

export const FLAG_KINDS = [
  "unreachable",
  "joint-limit",
  "joint-speed",
  "pulse-range",
  "ground-penetration",
  "foot-slip",
  "support-count",
  "com-outside",
  "low-margin",
  "leg-clearance",
  "loop-jump",
] as const;
export type FlagKind = (typeof FLAG_KINDS)[number];
export type Severity = "error" | "warning";

export type SolvedLeg = {
  contact: Contact;
  /** The planned foot (mm) in the moved body frame: the world foot is T(body)·foot. */
  foot: Vec3;
  reachable: boolean;
  /** Servo degrees; an unreachable leg keeps its last reachable angles (never NaN). */
  angles: JointAngles;
  /** Pulse widths (µs), clamped to each servo's minUs..maxUs, not rounded. */
  pulses: JointAngles;
};

export type SolvedFrame = {
  index: number;
  /** index · 1000 / fps: when the frame plays. */
  timeMs: number;
  /** The body's pose in the world: x, y, z (mm) and roll, pitch, yaw (degrees) of R = Rz·Ry·Rx. */
  body: BodyPose;
  legs: Record<string, SolvedLeg>;
  /** Convex hull of the stance feet on the ground, world [x, y] mm, counter-clockwise. */
  support: [number, number][];
  /** The CoM's ground projection, world [x, y] mm. */
  com: [number, number];
  /** Distance (mm) from the CoM to the nearest support-polygon edge, negative outside; null with fewer than three feet down. */
  marginMm: number | null;
};

export type Flag = {
  frame: number;
  leg?: string;
  joint?: JointName;
  kind: FlagKind;
  /** The offending number, in the unit the message gives. */
  value: number;
  limit: number;
  severity: Severity;
  message: string;
};

export type SolveSummary = {
  /** Number of frames solved. */
  frames: number;
  /** The frame rate the frames were solved at (the sequence's, or the `fps` option). */
  fps: number;
  flagsByKind: Partial<Record<FlagKind, number>>;
  errors: number;
  warnings: number;
  /** Smallest margin over the frames with three or more feet down (and the body not resting); null if there is none. */
  worstMarginMm: number | null;
  worstMarginFrame: number | null;
  /** Peak joint speed (°/s) per leg and joint, between consecutive frames. */
  peakSpeedDegS: Record<string, JointAngles>;
  /** Fraction of the cycle each foot is in stance, from the keys. */
  dutyFactor: Record<string, number>;
  strideMm: number;
  /** strideMm / cycle time, mm/s. */
  bodySpeedMmS: number;
  /**
   * The playback speed factor at which the first joint reaches its maxSpeedDegS
   * (min over joints of maxSpeedDegS / peak speed): above 1 there is room, below 1
   * some joint is already too fast. Null when no joint moves.
   */
  speedHeadroom: number | null;
  /** True for a dynamic gait (trot), whose static support flags are warnings. */
  dynamic: boolean;
};

export type SolvedSequence = { frames: SolvedFrame[]; flags: Flag[]; summary: SolveSummary };

export type SolveOptions = {
  /** low-margin below this, mm (default 10). */
  marginThresholdMm?: number;
  /** foot-slip when a stance foot moves more than this in the world between frames, mm (default 0.5). */
  slipToleranceMm?: number;
  /** leg-clearance when neighbouring feet come closer than this, mm (default 20). */
  clearanceMm?: number;
  /** ground-penetration when a foot is deeper than this below the ground, mm (default 0.01). */
  groundToleranceMm?: number;
  /** Solve at another frame rate (the exporter's rate); default the sequence's fps. */
  fps?: number;
  /** Run only these checks (default all). */
  checks?: readonly FlagKind[];
};
