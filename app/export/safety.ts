// The safety cautions of DESIGN.md ("Safety"), in short: written into every
// JSON and C table and shown on the export page. The tables drive real motors.

export const SAFETY_NOTICE: readonly string[] = Object.freeze([
  "This table drives real motors.",
  "Test with the robot on a stand and its legs free.",
  "Use a current-limited supply and keep a power cut-off within reach.",
  "Keep fingers clear of moving joints.",
  "Check each servo's direction alone first.",
  "Software limits are no substitute for mechanical stops or the servo maker's ratings.",
  "Local rules and the robot maker's instructions come first.",
]);
