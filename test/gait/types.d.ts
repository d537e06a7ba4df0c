// The outside references used by the gait tests that ship without types.
declare module "monotone-convex-hull-2d" {
  /** Indices of the hull's points (Andrew's monotone chain), collinear points left out. */
  export default function convexHull(points: readonly (readonly [number, number])[]): number[];
}
