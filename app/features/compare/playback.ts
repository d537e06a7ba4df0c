// What the robot views need to play a solved sequence: per frame, the body's
// height and tilt and each leg's servo angles, rounded to what a screen can
// show, so a comparison page carries kilobytes rather than the whole solve. Pure.
import type { SolvedSequence } from "../../gait/index";
import type { JointAngles } from "../../kinematics/index";

export type PlaybackFrame = {
  /** Body origin above the ground, mm. */
  heightMm: number;
  rollDeg: number;
  pitchDeg: number;
  /** Servo degrees per leg. */
  angles: Record<string, JointAngles>;
  marginMm: number | null;
  /** Legs with their foot down. */
  stance: string[];
};

export type Playback = { cycleMs: number; fps: number; loop: boolean; frames: PlaybackFrame[] };

const round = (value: number, places: number) => {
  const scale = 10 ** places;
  return Math.round(value * scale) / scale;
};

export function playbackOf(solved: SolvedSequence, cycleMs: number, loop: boolean): Playback {
  return {
    cycleMs,
    fps: solved.summary.fps,
    loop,
    frames: solved.frames.map((frame) => ({
      heightMm: round(frame.body.z, 2),
      rollDeg: round(frame.body.roll, 3),
      pitchDeg: round(frame.body.pitch, 3),
      angles: Object.fromEntries(
        Object.entries(frame.legs).map(([legId, leg]) => [
          legId,
          { coxa: round(leg.angles.coxa, 3), femur: round(leg.angles.femur, 3), tibia: round(leg.angles.tibia, 3) },
        ]),
      ),
      marginMm: frame.marginMm === null ? null : round(frame.marginMm, 1),
      stance: Object.entries(frame.legs)
        .filter(([, leg]) => leg.contact === "stance")
        .map(([legId]) => legId),
    })),
  };
}

/** The frame shown at cycle fraction `fraction` (0..1): the last frame at or before it. */
export function frameAt(playback: Pick<Playback, "frames" | "loop">, fraction: number): number {
  const count = playback.frames.length;
  if (count === 0) return 0;
  const span = playback.loop ? count : count - 1;
  const index = Math.floor(Math.min(Math.max(fraction, 0), 1) * span + 1e-9);
  return playback.loop ? index % count : Math.min(index, count - 1);
}

/** How two playbacks share one clock: "phase" runs both through their cycles at A's pace; "time" runs each at its own cycle time. */
export type SyncMode = "phase" | "time";

/** The cycle fraction A and B show at `timeMs` of the shared clock. */
export function syncedFractions(timeMs: number, mode: SyncMode, cycleAMs: number, cycleBMs: number): [number, number] {
  const fraction = (cycleMs: number) => (((timeMs % cycleMs) + cycleMs) % cycleMs) / cycleMs;
  return mode === "phase" ? [fraction(cycleAMs), fraction(cycleAMs)] : [fraction(cycleAMs), fraction(cycleBMs)];
}
