// A compact, column-shaped layout of a solve for transfer (POST /api/v1/solve
// with options.layout "columns"): one float32 column per quantity instead of
// one object per frame, sent as base64 of its little-endian bytes. Turning
// 60 000 numbers into decimal text was most of a 1 000-frame answer's cost;
// bytes in base64 are a third smaller and cost next to nothing to write or
// read. float32 keeps 7 significant digits: 0.001 mm at 10 m of travel.
// The frame layout of DESIGN.md stays the default.
import { JOINT_NAMES, SOLVE_UNREACHABLE, type JointName } from "../kinematics/index";
import type { SolveRun } from "./solve";
import type { Flag, SolveSummary } from "./solved";

export const COLUMNS_LAYOUT = "gaitloom.solve-columns/2";
export const COLUMNS_ENCODING = "float32 little-endian, base64";

type JointColumns<C> = Record<JointName, C>;

/** `C` is Float32Array in memory and its base64 text on the wire (encodeColumns / decodeColumns). */
export type SolveColumns<C = Float32Array> = {
  layout: typeof COLUMNS_LAYOUT;
  /** How each column's text decodes: one value a frame. */
  encoding: typeof COLUMNS_ENCODING;
  frames: number;
  fps: number;
  legs: string[];
  joints: readonly JointName[];
  /** Body pose in the world per frame (mm, degrees). */
  body: { x: C; y: C; z: C; roll: C; pitch: C; yaw: C };
  leg: Record<
    string,
    {
      /** One character a frame: "s" stance, "w" swing. */
      contact: string;
      foot: { x: C; y: C; z: C };
      /** Frames where the leg was out of reach (its angles held). */
      unreachableFrames: number[];
      angles: JointColumns<C>;
      pulses: JointColumns<C>;
    }
  >;
  /** Distinct support polygons as flat [x0, y0, x1, y1, …] (mm, 0.0001); supportIndex[frame] picks one. */
  supportPolygons: number[][];
  supportIndex: number[];
  com: { x: C; y: C };
  /** NaN where fewer than three feet are down (the frame layout's null). */
  marginMm: C;
  flags: Flag[];
  summary: SolveSummary;
};

const round = (value: number) => Math.round(value * 10_000) / 10_000 || 0;

/** Every `stride`-th value of `source` from `offset` on, as float32: one column of an interleaved array. */
function strided(source: Float64Array, offset: number, stride: number): Float32Array {
  const column = new Float32Array(source.length / stride);
  for (let i = 0, at = offset; i < column.length; i += 1, at += stride) column[i] = source[at];
  return column;
}

/** The column layout of a solve, read straight from its typed arrays (no frame objects). */
export function columnsOf(run: SolveRun): SolveColumns {
  const { state, world } = run;
  const { legIds, legCount, frameCount, stance, status, angles, pulses, targetBody } = state;
  const { bodyWorld, comWorld } = world;
  const perLeg = legCount * 3;
  const leg: SolveColumns["leg"] = {};
  legIds.forEach((legId, l) => {
    const contact = new Array<string>(frameCount);
    const unreachableFrames: number[] = [];
    for (let frame = 0; frame < frameCount; frame += 1) {
      const slot = frame * legCount + l;
      contact[frame] = stance[slot] === 1 ? "s" : "w";
      if (status[slot] & SOLVE_UNREACHABLE) unreachableFrames.push(frame);
    }
    const joints = (source: Float64Array) => ({
      coxa: strided(source, l * 3, perLeg),
      femur: strided(source, l * 3 + 1, perLeg),
      tibia: strided(source, l * 3 + 2, perLeg),
    });
    leg[legId] = {
      contact: contact.join(""),
      foot: { x: strided(targetBody, l * 3, perLeg), y: strided(targetBody, l * 3 + 1, perLeg), z: strided(targetBody, l * 3 + 2, perLeg) },
      unreachableFrames,
      angles: joints(angles),
      pulses: joints(pulses),
    };
  });
  return {
    layout: COLUMNS_LAYOUT,
    encoding: COLUMNS_ENCODING,
    frames: frameCount,
    fps: state.fps,
    legs: [...legIds],
    joints: JOINT_NAMES,
    body: {
      x: strided(bodyWorld, 0, 6),
      y: strided(bodyWorld, 1, 6),
      z: strided(bodyWorld, 2, 6),
      roll: strided(bodyWorld, 3, 6),
      pitch: strided(bodyWorld, 4, 6),
      yaw: strided(bodyWorld, 5, 6),
    },
    leg,
    supportPolygons: world.polygons.map((polygon) => polygon.flatMap(([x, y]) => [round(x), round(y)])),
    supportIndex: Array.from(world.polygonIndex),
    com: { x: strided(comWorld, 0, 2), y: strided(comWorld, 1, 2) },
    marginMm: Float32Array.from(state.margin),
    flags: run.flags,
    summary: run.summary,
  };
}

const mapJoints = <A, B>(joints: JointColumns<A>, f: (column: A) => B): JointColumns<B> => ({
  coxa: f(joints.coxa),
  femur: f(joints.femur),
  tibia: f(joints.tibia),
});

/** The same layout with every column passed through `f`: the one walk both encoding and decoding use. */
export function mapColumns<A, B>(columns: SolveColumns<A>, f: (column: A) => B): SolveColumns<B> {
  const { body, com, leg } = columns;
  return {
    ...columns,
    body: { x: f(body.x), y: f(body.y), z: f(body.z), roll: f(body.roll), pitch: f(body.pitch), yaw: f(body.yaw) },
    leg: Object.fromEntries(
      Object.entries(leg).map(([legId, one]) => [
        legId,
        { ...one, foot: { x: f(one.foot.x), y: f(one.foot.y), z: f(one.foot.z) }, angles: mapJoints(one.angles, f), pulses: mapJoints(one.pulses, f) },
      ]),
    ),
    com: { x: f(com.x), y: f(com.y) },
    marginMm: f(columns.marginMm),
  };
}

// Typed arrays hold the machine's byte order; the wire form is little-endian.
const LITTLE_ENDIAN = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

function littleEndianBytes(column: Float32Array): Uint8Array {
  const bytes = new Uint8Array(column.buffer, column.byteOffset, column.byteLength);
  if (LITTLE_ENDIAN) return bytes;
  const view = new DataView(new ArrayBuffer(column.byteLength));
  column.forEach((value, i) => view.setFloat32(i * 4, value, true));
  return new Uint8Array(view.buffer);
}

/** The wire form. `toBase64` is the platform's fastest (Buffer on the server); the fallback is plain btoa. */
export function encodeColumns(
  columns: SolveColumns,
  toBase64: (bytes: Uint8Array) => string = (bytes) => btoa(Array.from(bytes, (byte) => String.fromCharCode(byte)).join("")),
): SolveColumns<string> {
  return mapColumns(columns, (column) => toBase64(littleEndianBytes(column)));
}

/** Reads the wire form back into Float32Arrays (for clients and tests). */
export function decodeColumns(wire: SolveColumns<string>): SolveColumns {
  return mapColumns(wire, (text) => {
    const binary = atob(text);
    const view = new DataView(new ArrayBuffer(binary.length));
    for (let i = 0; i < binary.length; i += 1) view.setUint8(i, binary.charCodeAt(i));
    return Float32Array.from({ length: binary.length / 4 }, (_, i) => view.getFloat32(i * 4, true));
  });
}
