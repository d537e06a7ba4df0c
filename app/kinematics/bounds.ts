// The physical range of every number in a robot definition and a gait
// sequence. Wide enough for walkers of four to eight legs from tabletop size
// to large machines; narrow enough that every square and product in the solve
// stays far from overflow, every tolerance (1e-9 mm, 1e-9°) far below the
// numbers it compares, and no request can ask for unbounded work. The zod
// schemas apply them, so the published JSON Schemas say them too.
//
// Where each comes from: "common practice" is a fact of the trade without a
// single source; "margin" is a plain engineering margin around the largest
// (or smallest) value in use, not a physical law.

/** An inclusive range [min, max]. */
export type Bound = { readonly min: number; readonly max: number };

/**
 * Coxa, femur and tibia, joint to joint (mm). Up to 2 000 mm: the leg links of
 * the largest walking machines built are of that order (margin). At least
 * 1 mm: a shorter link is no link (a servo horn is larger), and the solve's
 * 1 mm coxa-axis clearance would swallow it.
 */
export const LINK_MM: Bound = { min: 1, max: 2000 };

/**
 * Mount positions and the centre of mass in the body frame (mm, each axis): a
 * body up to 10 m across, more than twice the farthest reach of the longest
 * leg (margin).
 */
export const BODY_POINT_MM: Bound = { min: -5000, max: 5000 };

/**
 * Height of the body origin above the ground (mm): the robot's standHeight and
 * a gait's bodyHeightMm. Up to the body's half-size; at least 1 mm above the
 * ground (margin).
 */
export const BODY_HEIGHT_MM: Bound = { min: 1, max: 5000 };

/** Total mass (kg): 1 g (a micro robot) to 10 t, five times the heaviest walking machines (margin). */
export const MASS_KG: Bound = { min: 0.001, max: 10_000 };

/** Joint limits, zero offsets, the rest pose and the mount yaw (degrees): a half turn either way, the range a servo angle is reported in. */
export const HALF_TURN_DEG: Bound = { min: -180, max: 180 };

/**
 * Fastest a joint may turn (°/s). Hobby servos turn about 300–600 °/s
 * (0.1–0.2 s per 60°, common practice, from memory); up to 36 000 °/s (100
 * turns a second) so that URDF files with placeholder velocities (often
 * 100 rad/s, 5 730 °/s) still import (margin). At least 1 °/s.
 */
export const JOINT_SPEED_DEG_S: Bound = { min: 1, max: 36_000 };

/**
 * Servo pulse widths (µs): centre, shortest and longest. Servos take about
 * 500–2 500 µs (1 000–2 000 µs nominal, 1 500 µs neutral; common practice);
 * 100–5 000 µs leaves room either way (margin) and stays well inside a 50 Hz
 * frame (20 000 µs) and a table's uint16_t.
 */
export const PULSE_US: Bound = { min: 100, max: 5000 };

/**
 * Pulse change per servo degree (µs/°): about 11.1 for 1 000 µs over 90°,
 * 5.6 over 180° (common practice); 0.1 (multi-turn winches) to 100 (margin).
 */
export const US_PER_DEG: Bound = { min: 0.1, max: 100 };

/** Servo controller output channel: 0–255, one byte (common practice). */
export const SERVO_CHANNEL: Bound = { min: 0, max: 255 };

/**
 * A gait's cycle (or a one-shot move's) duration (ms): 1 ms to 10 minutes.
 * The frame count, at most MAX_FRAMES, bounds the work; this bounds the time.
 */
export const CYCLE_MS: Bound = { min: 1, max: 600_000 };

/** Frame rate (frames a second): 1 to 1 000, a frame every millisecond at most (servo frames are 50–333 Hz, common practice). */
export const FRAME_RATE_FPS: Bound = { min: 1, max: 1000 };

/**
 * Body travel per cycle (mm, signed): up to 10 m, more than twice the longest
 * leg's full reach fore and aft, the most a foot in stance can sweep (margin).
 */
export const STRIDE_MM: Bound = { min: -10_000, max: 10_000 };

/** Direction of travel and turn per cycle (degrees): a full turn either way; a leg cannot turn the body more in one cycle. */
export const FULL_TURN_DEG: Bound = { min: -360, max: 360 };

/** Swing height, a step's or a key's apex (mm): up to 1 m, half the longest link (margin). */
export const STEP_HEIGHT_MM: Bound = { min: 0, max: 1000 };

/**
 * A key's foot in the neutral body frame (mm, each axis): the largest robot
 * reaches 11 000 mm (5 000 mm mount and three 2 000 mm links); 20 000 mm lets a
 * target lie well out of reach, which the solve flags (margin).
 */
export const FOOT_MM: Bound = { min: -20_000, max: 20_000 };

/** A body key's translation offset (mm, each axis): within the body's range, so a body can be lowered from its greatest height to the ground. */
export const BODY_OFFSET_MM: Bound = BODY_POINT_MM;

/**
 * The y values of a cubic-Bézier easing: CSS allows any; the usual overshoot
 * ("back") curves stay within −1..2 (common practice); ±10 is ample (margin).
 * The x values stay in [0, 1] (W3C CSS Easing Functions Level 1).
 */
export const EASE_Y: Bound = { min: -10, max: 10 };

/** "mm (1 to 2 000)": a bound in words for a schema description, with the unit. */
export function rangeText(unit: string, bound: Bound): string {
  return `${unit} (${numberText(bound.min)} to ${numberText(bound.max)})`;
}

// 10000 → "10 000", −5000 → "−5 000", 0.001 → "0.001": digits grouped in threes, a true minus.
function numberText(value: number): string {
  const [whole, fraction] = String(Math.abs(value)).split(".");
  const grouped = whole.replace(/\B(?=(\d{3})+$)/g, " ");
  return `${value < 0 ? "−" : ""}${grouped}${fraction ? `.${fraction}` : ""}`;
}
