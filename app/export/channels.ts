// The columns of a table: one per joint, in servo-channel order (ascending
// channel number), each with the servo as this physical unit has it — the
// robot's servo with the calibration's channel and reversal overrides — and
// the calibration's trim. Two joints on one channel is refused.
import { JOINT_NAMES, type JointName, type Robot, type Servo } from "../kinematics/index";
import { calibrationIssuesForRobot, jointCalibration, parseCalibrationProfile, type CalibrationProfile, type ValidCalibrationProfile } from "./calibration";
import { TableExportError } from "./errors";

export type TableChannel = {
  /** Place in the table's rows, 0-based. */
  column: number;
  /** Servo controller output, after the calibration. */
  channel: number;
  legId: string;
  joint: JointName;
  /** Header name, `LF.coxa`. */
  name: string;
  /** The robot's servo with the calibration's channel and reversal. */
  servo: Servo;
  /** Degrees added to every servo angle of this joint (0 without calibration). */
  trimDeg: number;
  /** Where the robot's frames hold this joint: index of the leg in robot.legs. */
  legIndex: number;
};

export type TableChannels = {
  channels: TableChannel[];
  /** The calibration profile's name, or null. */
  calibrationProfile: string | null;
};

function parseValidProfile(robot: Robot, calibration: CalibrationProfile): ValidCalibrationProfile {
  const parsed = parseCalibrationProfile(calibration);
  if (!parsed.ok) throw new TableExportError("calibration-mismatch", "the calibration profile is not valid", parsed.issues);
  const issues = calibrationIssuesForRobot(robot, parsed.profile);
  if (issues.length)
    throw new TableExportError("calibration-mismatch", `calibration profile "${parsed.profile.name}" does not fit robot "${robot.name}"`, issues);
  return parsed.profile;
}

/**
 * The table's columns for a robot and an optional calibration profile. Throws
 * TableExportError "calibration-mismatch" for a profile that is not valid or
 * names another robot's legs, "duplicate-channel" when two joints end up on one channel.
 */
export function tableChannels(robot: Robot, calibration?: CalibrationProfile): TableChannels {
  let profile: ValidCalibrationProfile | undefined;
  if (calibration !== undefined) profile = parseValidProfile(robot, calibration);
  const channels: TableChannel[] = [];
  robot.legs.forEach((leg, legIndex) => {
    for (const joint of JOINT_NAMES) {
      const own = leg.joints[joint].servo;
      const override = jointCalibration(profile, leg.id, joint);
      channels.push({
        column: 0,
        channel: override.channel ?? own.channel,
        legId: leg.id,
        joint,
        name: `${leg.id}.${joint}`,
        servo: { ...own, channel: override.channel ?? own.channel, reversed: override.reversed ?? own.reversed },
        trimDeg: override.trimDeg ?? 0,
        legIndex,
      });
    }
  });
  channels.sort((a, b) => a.channel - b.channel);
  const issues: { path: string; message: string }[] = [];
  for (let i = 1; i < channels.length; i += 1) {
    const before = channels[i - 1];
    const here = channels[i];
    if (before.channel !== here.channel) continue;
    const source = (entry: TableChannel): string =>
      jointCalibration(profile, entry.legId, entry.joint).channel !== undefined ? `set by calibration "${profile?.name}"` : "from the robot";
    issues.push({
      path:
        jointCalibration(profile, here.legId, here.joint).channel !== undefined
          ? `joints.${here.legId}.${here.joint}.channel`
          : `joints.${before.legId}.${before.joint}.channel`,
      message: `channel ${here.channel} would drive both ${before.name} (${source(before)}) and ${here.name} (${source(here)})`,
    });
  }
  if (issues.length) {
    throw new TableExportError("duplicate-channel", `two joints share a servo channel after calibration "${profile?.name ?? ""}"`, issues);
  }
  channels.forEach((entry, column) => (entry.column = column));
  return { channels, calibrationProfile: profile?.name ?? null };
}
