// Calibration profiles: one physical unit of a robot (named, e.g. by its serial
// number) differs from the robot definition by a small trim per joint, a servo
// mounted the other way round, or a servo plugged into another channel. The
// profile is applied at export (channels.ts) and its name is written into the
// table's header. Validated with zod; issues come as { path, message }.
import { z } from "zod";
import { JOINT_NAMES, formatIssues, type Robot } from "../kinematics/index";
import type { TableExportIssue } from "./errors";

/** Largest trim a profile may hold, degrees: more is a change of the robot's zeroOffsetDeg, not a unit's calibration. */
export const MAX_TRIM_DEG = 45;

const jointCalibrationSchema = z.strictObject({
  trimDeg: z.number().min(-MAX_TRIM_DEG).max(MAX_TRIM_DEG).optional().describe("Added to the servo angle of every frame, degrees (before the pulse mapping)."),
  reversed: z.boolean().optional().describe("Overrides the robot's servo.reversed for this unit."),
  channel: z.number().int().min(0).max(255).optional().describe("Overrides the robot's servo.channel for this unit."),
});

export const calibrationProfileSchema = z
  .strictObject({
    name: z.string().trim().min(1).max(120).describe("Names the physical unit, e.g. its serial number; written into the table header."),
    description: z.string().max(2000).optional(),
    joints: z
      .record(
        z.string(),
        z.strictObject({
          coxa: jointCalibrationSchema.optional(),
          femur: jointCalibrationSchema.optional(),
          tibia: jointCalibrationSchema.optional(),
        }),
      )
      .describe("Per leg id, per joint: the overrides of this unit."),
  })
  .meta({
    title: "Gaitloom calibration profile",
    description: "Per-joint trim, reversal and channel overrides of one physical unit of a robot, applied when a table is exported.",
  });

export type CalibrationProfile = z.input<typeof calibrationProfileSchema>;
/** A profile as parseCalibrationProfile returns it (name trimmed). */
export type ValidCalibrationProfile = z.output<typeof calibrationProfileSchema>;
export type JointCalibration = z.output<typeof jointCalibrationSchema>;

export type ParseCalibrationResult = { ok: true; profile: ValidCalibrationProfile } | { ok: false; issues: TableExportIssue[] };

/** Validates an untrusted calibration profile (already JSON-decoded); paths like `joints.LF.femur.trimDeg`. */
export function parseCalibrationProfile(json: unknown): ParseCalibrationResult {
  const result = calibrationProfileSchema.safeParse(json, { reportInput: true });
  if (result.success) return { ok: true, profile: result.data };
  return { ok: false, issues: formatIssues(result.error.issues) };
}

/** The JSON Schema of a calibration profile, generated from the zod schema (draft 2020-12). */
export function calibrationProfileJsonSchema(): Record<string, unknown> {
  return z.toJSONSchema(calibrationProfileSchema, { io: "input", target: "draft-2020-12" }) as Record<string, unknown>;
}

/**
 * Problems of a valid profile against a robot: every leg it names must be one
 * of the robot's. (Duplicate channels after the overrides are found where the
 * channels are laid out, tableChannels.)
 */
export function calibrationIssuesForRobot(robot: Robot, profile: ValidCalibrationProfile): TableExportIssue[] {
  const legIds = new Set(robot.legs.map((leg) => leg.id));
  const issues: TableExportIssue[] = [];
  for (const legId of Object.keys(profile.joints)) {
    if (!legIds.has(legId)) {
      issues.push({ path: `joints.${legId}`, message: `names no leg of robot "${robot.name}" (legs: ${[...legIds].join(", ")})` });
    }
  }
  return issues;
}

/** The calibration of one joint, empty when the profile says nothing of it. */
export function jointCalibration(profile: ValidCalibrationProfile | undefined, legId: string, joint: (typeof JOINT_NAMES)[number]): JointCalibration {
  return profile?.joints[legId]?.[joint] ?? {};
}
