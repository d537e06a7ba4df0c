// The drawing frames of the two views. Bounds come from the robot alone (every
// mount plus its leg's full reach), so the picture holds still while feet move.
import { scaleLinear, type ScaleLinear } from "d3-scale";
import type { Robot } from "~/kinematics";

export type ViewFrame = {
  width: number;
  height: number;
  /** Screen x and y of a body-frame point, px. */
  toScreen: (a: number, b: number) => [number, number];
  /** Pixels per millimetre (the same both ways). */
  pxPerMm: number;
  horizontal: ScaleLinear<number, number>;
  vertical: ScaleLinear<number, number>;
};

const MARGIN_PX = 14;

/**
 * A frame fitting the two ranges (mm, in the scales' directions) into width × height px
 * with equal scales; spare height goes above the drawing when `bottom` is set.
 */
function fitFrame(width: number, height: number, horizontalMm: [number, number], verticalMm: [number, number], bottom = false): ViewFrame {
  const spanH = Math.max(1, Math.abs(horizontalMm[1] - horizontalMm[0]));
  const spanV = Math.max(1, Math.abs(verticalMm[1] - verticalMm[0]));
  const pxPerMm = Math.min((width - 2 * MARGIN_PX) / spanH, (height - 2 * MARGIN_PX) / spanV);
  const padH = (width - spanH * pxPerMm) / 2;
  const padV = (height - spanV * pxPerMm) / 2;
  const horizontal = scaleLinear()
    .domain(horizontalMm)
    .range([padH, width - padH]);
  const vertical = bottom
    ? scaleLinear()
        .domain(verticalMm)
        .range([2 * padV - MARGIN_PX, height - MARGIN_PX])
    : scaleLinear()
        .domain(verticalMm)
        .range([padV, height - padV]);
  return { width, height, pxPerMm, horizontal, vertical, toScreen: (a, b) => [horizontal(a), vertical(b)] };
}

/**
 * How far out from its mount a leg's foot can get at the standing height, mm
 * (the reach of the femur and tibia at that depth plus the coxa), with room for
 * a lifted foot: the views frame this, not the leg stretched out sideways.
 */
function legReach(leg: Robot["legs"][number], standHeightMm: number): number {
  const depth = Math.max(0, standHeightMm + leg.mount.z - 0.25 * leg.femur);
  const span = leg.femur + leg.tibia;
  return leg.coxa + (depth < span ? Math.sqrt(span * span - depth * depth) : 0.5 * span) + 8;
}

/** Seen from above: forward (+x) up the screen, left (+y) to the screen's left. toScreen takes (x, y). */
export function topFrame(robot: Robot, width: number, height: number): ViewFrame {
  let xMin = Infinity;
  let xMax = -Infinity;
  let yMin = Infinity;
  let yMax = -Infinity;
  for (const leg of robot.legs) {
    const reach = legReach(leg, robot.standHeight);
    xMin = Math.min(xMin, leg.mount.x - reach);
    xMax = Math.max(xMax, leg.mount.x + reach);
    yMin = Math.min(yMin, leg.mount.y - reach);
    yMax = Math.max(yMax, leg.mount.y + reach);
  }
  if (!Number.isFinite(xMin)) [xMin, xMax, yMin, yMax] = [-100, 100, -100, 100];
  // Screen horizontal is −y (left to the left), screen vertical is −x (forward up).
  const frame = fitFrame(width, height, [yMax, yMin], [xMax, xMin]);
  return { ...frame, toScreen: (x, y) => [frame.horizontal(y), frame.vertical(x)] };
}

/** Seen from the robot's right: forward (+x) to the right, up (+z) up. toScreen takes (x, z); the ground is z = −bodyHeightMm. */
export function sideFrame(robot: Robot, width: number, height: number, bodyHeightMm: number = robot.standHeight): ViewFrame {
  let xMin = Infinity;
  let xMax = -Infinity;
  let zMax = -Infinity;
  for (const leg of robot.legs) {
    const reach = legReach(leg, bodyHeightMm);
    xMin = Math.min(xMin, leg.mount.x - reach);
    xMax = Math.max(xMax, leg.mount.x + reach);
    // Knees rise above the mount; most of a femur's length is room enough.
    zMax = Math.max(zMax, leg.mount.z + 0.8 * leg.femur);
  }
  if (!Number.isFinite(xMin)) [xMin, xMax, zMax] = [-100, 100, 60];
  const zMin = -bodyHeightMm - 12;
  return fitFrame(width, height, [xMin, xMax], [Math.max(zMax, 20), zMin], true);
}
