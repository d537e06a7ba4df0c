// A compact, column-shaped layout of a solve for transfer (POST /api/v1/solve
// with options.layout "columns"): one array per quantity instead of one object
// per frame, numbers rounded to 0.0001 of their unit, repeated support
// polygons stored once. The frame layout of DESIGN.md stays the default.
import { JOINT_NAMES, type JointName } from "../kinematics/index";
import type { Flag, SolveSummary, SolvedSequence } from "./solved";

export const COLUMNS_LAYOUT = "gaitloom.solve-columns/1";

type Column = number[];
type JointColumns = Record<JointName, Column>;

export type SolveColumns = {
  layout: typeof COLUMNS_LAYOUT;
  frames: number;
  fps: number;
  legs: string[];
  joints: readonly JointName[];
  /** Body pose in the world per frame (mm, degrees). */
  body: { x: Column; y: Column; z: Column; roll: Column; pitch: Column; yaw: Column };
  leg: Record<
    string,
    {
      /** One character a frame: "s" stance, "w" swing. */
      contact: string;
      foot: { x: Column; y: Column; z: Column };
      /** Frames where the leg was out of reach (its angles held). */
      unreachableFrames: number[];
      angles: JointColumns;
      pulses: JointColumns;
    }
  >;
  /** Distinct support polygons as flat [x0, y0, x1, y1, …]; supportIndex[frame] picks one. */
  supportPolygons: number[][];
  supportIndex: number[];
  com: { x: Column; y: Column };
  marginMm: (number | null)[];
  flags: Flag[];
  summary: SolveSummary;
};

const round = (value: number) => Math.round(value * 10_000) / 10_000 || 0;

export function toColumns(solved: SolvedSequence): SolveColumns {
  const { frames } = solved;
  const legs = frames.length > 0 ? Object.keys(frames[0].legs) : [];
  const column = (pick: (index: number) => number): Column => frames.map((_, index) => round(pick(index)));
  const jointColumns = (legId: string, field: "angles" | "pulses") =>
    Object.fromEntries(JOINT_NAMES.map((joint) => [joint, column((i) => frames[i].legs[legId][field][joint])])) as JointColumns;

  const polygonIds = new Map<unknown, number>();
  const supportPolygons: number[][] = [];
  const supportIndex = frames.map((frame) => {
    // Consecutive frames with the same stance feet share one polygon array.
    let id = polygonIds.get(frame.support);
    if (id === undefined) {
      id = supportPolygons.push(frame.support.flatMap(([x, y]) => [round(x), round(y)])) - 1;
      polygonIds.set(frame.support, id);
    }
    return id;
  });

  return {
    layout: COLUMNS_LAYOUT,
    frames: frames.length,
    fps: solved.summary.fps,
    legs,
    joints: JOINT_NAMES,
    body: {
      x: column((i) => frames[i].body.x),
      y: column((i) => frames[i].body.y),
      z: column((i) => frames[i].body.z),
      roll: column((i) => frames[i].body.roll),
      pitch: column((i) => frames[i].body.pitch),
      yaw: column((i) => frames[i].body.yaw),
    },
    leg: Object.fromEntries(
      legs.map((legId) => [
        legId,
        {
          contact: frames.map((frame) => (frame.legs[legId].contact === "stance" ? "s" : "w")).join(""),
          foot: {
            x: column((i) => frames[i].legs[legId].foot[0]),
            y: column((i) => frames[i].legs[legId].foot[1]),
            z: column((i) => frames[i].legs[legId].foot[2]),
          },
          unreachableFrames: frames.flatMap((frame) => (frame.legs[legId].reachable ? [] : [frame.index])),
          angles: jointColumns(legId, "angles"),
          pulses: jointColumns(legId, "pulses"),
        },
      ]),
    ),
    supportPolygons,
    supportIndex,
    com: { x: column((i) => frames[i].com[0]), y: column((i) => frames[i].com[1]) },
    marginMm: frames.map((frame) => (frame.marginMm === null ? null : round(frame.marginMm))),
    flags: solved.flags,
    summary: solved.summary,
  };
}
