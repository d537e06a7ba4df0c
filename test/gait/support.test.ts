import "jsts/org/locationtech/jts/monkey.js";
import Coordinate from "jsts/org/locationtech/jts/geom/Coordinate.js";
import GeometryFactory from "jsts/org/locationtech/jts/geom/GeometryFactory.js";
import monotoneConvexHull from "monotone-convex-hull-2d";
import { describe, expect, it } from "vitest";
import { generateGait, solveSequence, type GaitParams, type SolvedFrame } from "~/gait/index";
import { convexHullInto, stabilityMargin } from "~/gait/support";
import { DEMO_ROBOTS, loadDemoRobot, type DemoRobotFile } from "../support/robots";
import { worldFoot } from "./helpers";

// Support polygon = convex hull of the stance feet on the ground, checked
// against monotone-convex-hull-2d; the CoM's containment and its distance to
// the polygon's boundary against jsts (the JTS Topology Suite port). The margin
// is the static stability margin of R. B. McGhee and A. A. Frank, "On the
// stability properties of quadruped creeping gaits", Mathematical Biosciences 3
// (1968): the shortest distance from the CoM's ground projection to the
// support polygon's boundary (negative outside, in our sign).

type JstsGeometry = { contains(other: unknown): boolean; distance(other: unknown): number; getBoundary(): JstsGeometry };
const factory = new GeometryFactory();

function polygon(points: readonly [number, number][]): JstsGeometry {
  const ring = [...points, points[0]].map(([x, y]) => new Coordinate(x, y));
  return factory.createPolygon(factory.createLinearRing(ring), []) as unknown as JstsGeometry;
}

function point([x, y]: readonly [number, number]): unknown {
  return factory.createPoint(new Coordinate(x, y));
}

const GAITS: [string, DemoRobotFile, GaitParams][] = [
  ["six-leg tripod, turning", DEMO_ROBOTS.six, { template: "tripod", strideMm: 50, turnDegPerCycle: 20 }],
  ["six-leg wave that lifts too many legs (β = 0.4)", DEMO_ROBOTS.six, { template: "wave", dutyFactor: 0.4, strideMm: 40 }],
  ["four-leg crawl (CoM outside at times)", DEMO_ROBOTS.four, { template: "wave", strideMm: 40, cycleMs: 2400 }],
  [
    "eight-leg wave with a lean",
    DEMO_ROBOTS.eight,
    {
      template: "wave",
      strideMm: 40,
      cycleMs: 3200,
      bodyKeys: [
        { t: 0, pose: { roll: 0 } },
        { t: 0.5, pose: { roll: 8, x: 10 } },
      ],
    },
  ],
];

function solvedFrames(file: DemoRobotFile, params: GaitParams): SolvedFrame[] {
  const robot = loadDemoRobot(file);
  return solveSequence(robot, generateGait(robot, { cycleMs: 1200, fps: 50, ...params }), { checks: [] }).frames;
}

describe("support polygon against monotone-convex-hull-2d, margin against jsts (McGhee and Frank 1968)", () => {
  for (const [name, file, params] of GAITS) {
    it(`${name}: hull, containment and margin on every frame`, () => {
      const frames = solvedFrames(file, params);
      let inside = 0;
      let outside = 0;
      for (const frame of frames) {
        const feet = Object.keys(frame.legs)
          .filter((legId) => frame.legs[legId].contact === "stance")
          .map((legId) => worldFoot(frame, legId).slice(0, 2) as [number, number]);
        // The library lists the hull clockwise; ours runs counter-clockwise.
        const expectedHull = monotoneConvexHull(feet)
          .map((index) => feet[index])
          .reverse();
        if (feet.length < 3) {
          expect(frame.marginMm, `frame ${frame.index}: ${feet.length} feet down, margin must be null`).toBeNull();
          continue;
        }
        expect(frame.support.length, `frame ${frame.index}: hull vertices`).toBe(expectedHull.length);
        // Same cycle of vertices, starting anywhere.
        const start = expectedHull.findIndex(([x, y]) => Math.hypot(x - frame.support[0][0], y - frame.support[0][1]) < 1e-6);
        expect(start, `frame ${frame.index}: first hull vertex ${frame.support[0]} not in the reference hull`).toBeGreaterThanOrEqual(0);
        expectedHull.forEach((_, i) => {
          const [ex, ey] = expectedHull[(start + i) % expectedHull.length];
          const [gx, gy] = frame.support[i];
          expect(Math.hypot(ex - gx, ey - gy), `frame ${frame.index} hull vertex ${i}: expected (${ex}, ${ey}), got (${gx}, ${gy})`).toBeLessThan(1e-6);
        });
        const region = polygon(expectedHull);
        const com = point(frame.com);
        const contains = region.contains(com);
        const boundaryDistance = region.getBoundary().distance(com);
        const expectedMargin = contains ? boundaryDistance : -boundaryDistance;
        expect(frame.marginMm! > 0, `frame ${frame.index}: CoM inside per jsts = ${contains}, margin ${frame.marginMm} mm`).toBe(contains);
        expect(
          Math.abs(frame.marginMm! - expectedMargin),
          `frame ${frame.index}: margin expected ${expectedMargin.toFixed(6)} mm (jsts), got ${frame.marginMm!.toFixed(6)} mm`,
        ).toBeLessThan(1e-9);
        if (contains) inside += 1;
        else outside += 1;
      }
      expect(inside + outside).toBeGreaterThan(0);
    });
  }

  it("the four-leg crawl puts the CoM both inside and outside the polygon (the test covers both signs)", () => {
    const frames = solvedFrames(DEMO_ROBOTS.four, { template: "wave", strideMm: 40, cycleMs: 2400 });
    const margins = frames.map((frame) => frame.marginMm).filter((margin): margin is number => margin !== null);
    expect(Math.min(...margins)).toBeLessThan(0);
    expect(Math.max(...margins)).toBeGreaterThan(0);
  });
});

describe("convexHullInto and stabilityMargin on seeded random point sets (monotone-convex-hull-2d, jsts)", () => {
  it("2 000 sets of 3 to 8 points, some collinear or repeated", () => {
    let seed = 12345;
    // Park–Miller minimal standard generator, for a repeatable sequence.
    const random = (): number => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const order = new Int32Array(8);
    const hull = new Int32Array(9);
    for (let round = 0; round < 2000; round += 1) {
      const count = 3 + Math.floor(random() * 6);
      const points: [number, number][] = [];
      for (let i = 0; i < count; i += 1) {
        const kind = random();
        if (kind < 0.1 && points.length > 0) points.push([...points[0]]);
        else if (kind < 0.2 && points.length > 1) points.push([(points[0][0] + points[1][0]) / 2, (points[0][1] + points[1][1]) / 2]);
        else points.push([Math.round(random() * 400 - 200), Math.round(random() * 400 - 200)]);
      }
      const xs = Float64Array.from(points, (p) => p[0]);
      const ys = Float64Array.from(points, (p) => p[1]);
      const size = convexHullInto(xs, ys, count, order, hull);
      const ours = Array.from(hull.subarray(0, size), (index) => `${xs[index]},${ys[index]}`);
      const reference = monotoneConvexHull(points)
        .map((index) => `${points[index][0]},${points[index][1]}`)
        .reverse();
      if (reference.length >= 3) {
        const start = reference.indexOf(ours[0]);
        const rotated = [...reference.slice(start), ...reference.slice(0, start)];
        expect(ours, `round ${round}: points ${JSON.stringify(points)}`).toEqual(rotated);
        const com: [number, number] = [random() * 300 - 150, random() * 300 - 150];
        const region = polygon(reference.map((text) => text.split(",").map(Number) as [number, number]));
        const expected = (region.contains(point(com)) ? 1 : -1) * region.getBoundary().distance(point(com));
        const got = stabilityMargin(xs, ys, hull, size, com[0], com[1]);
        expect(Math.abs(got - expected), `round ${round}: margin expected ${expected} mm, got ${got} mm`).toBeLessThan(1e-9);
      } else {
        expect(new Set(ours).size, `round ${round}: degenerate hull of ${JSON.stringify(points)}`).toBe(new Set(reference).size);
      }
    }
  });
});
