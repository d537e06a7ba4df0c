// The support polygon and the static stability margin. The support polygon is
// the convex hull of the stance feet on the ground; the margin is the shortest
// distance from the CoM's ground projection to the polygon's boundary,
// positive inside (R. B. McGhee and A. A. Frank, "On the stability properties
// of quadruped creeping gaits", Mathematical Biosciences 3, 1968), and here
// negative outside. A handful of points per frame: the hull is Andrew's
// monotone chain with an insertion sort, into caller-owned index arrays, and
// Math.sqrt rather than the slower Math.hypot (distances here are far from overflow).

function cross(xs: ArrayLike<number>, ys: ArrayLike<number>, o: number, a: number, b: number): number {
  return (xs[a] - xs[o]) * (ys[b] - ys[o]) - (ys[a] - ys[o]) * (xs[b] - xs[o]);
}

/**
 * Convex hull of points (xs[i], ys[i]) for i < count: writes the hull's point
 * indices counter-clockwise, without collinear points, into `hull` and returns
 * how many. `order` is scratch of at least `count`, `hull` of at least count + 1.
 */
export function convexHullInto(xs: ArrayLike<number>, ys: ArrayLike<number>, count: number, order: Int32Array, hull: Int32Array): number {
  for (let i = 0; i < count; i += 1) {
    const value = i;
    let j = i - 1;
    while (j >= 0 && (xs[order[j]] > xs[value] || (xs[order[j]] === xs[value] && ys[order[j]] > ys[value]))) {
      order[j + 1] = order[j];
      j -= 1;
    }
    order[j + 1] = value;
  }
  if (count < 3) {
    let size = 0;
    for (let i = 0; i < count; i += 1) {
      if (size === 0 || xs[order[i]] !== xs[hull[size - 1]] || ys[order[i]] !== ys[hull[size - 1]]) hull[size++] = order[i];
    }
    return size;
  }
  let size = 0;
  for (let i = 0; i < count; i += 1) {
    const point = order[i];
    while (size >= 2 && cross(xs, ys, hull[size - 2], hull[size - 1], point) <= 0) size -= 1;
    hull[size++] = point;
  }
  const lowerSize = size + 1;
  for (let i = count - 2; i >= 0; i -= 1) {
    const point = order[i];
    while (size >= lowerSize && cross(xs, ys, hull[size - 2], hull[size - 1], point) <= 0) size -= 1;
    hull[size++] = point;
  }
  // The last point repeats the first.
  return size - 1;
}

function segmentDistance(ax: number, ay: number, bx: number, by: number, px: number, py: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const lengthSquared = dx * dx + dy * dy;
  let along = lengthSquared > 0 ? ((px - ax) * dx + (py - ay) * dy) / lengthSquared : 0;
  along = along < 0 ? 0 : along > 1 ? 1 : along;
  const ex = px - (ax + along * dx);
  const ey = py - (ay + along * dy);
  return Math.sqrt(ex * ex + ey * ey);
}

/**
 * Signed distance (mm) from (px, py) to the boundary of the convex polygon
 * hull[0..size) (counter-clockwise): positive inside, negative outside, 0 on
 * the edge. A degenerate polygon (a segment or a point) has no inside.
 */
export function stabilityMargin(xs: ArrayLike<number>, ys: ArrayLike<number>, hull: Int32Array, size: number, px: number, py: number): number {
  if (size === 0) return Number.NEGATIVE_INFINITY;
  if (size === 1) return -Math.hypot(px - xs[hull[0]], py - ys[hull[0]]);
  if (size === 2) return -segmentDistance(xs[hull[0]], ys[hull[0]], xs[hull[1]], ys[hull[1]], px, py);
  let inside = true;
  let nearestLine = Number.POSITIVE_INFINITY;
  for (let i = 0; i < size; i += 1) {
    const a = hull[i];
    const b = hull[(i + 1) % size];
    const ex = xs[b] - xs[a];
    const ey = ys[b] - ys[a];
    // Distance to the edge's line, positive on the left (the inside of a counter-clockwise polygon).
    const side = (ex * (py - ys[a]) - ey * (px - xs[a])) / Math.sqrt(ex * ex + ey * ey);
    if (side < 0) inside = false;
    if (side < nearestLine) nearestLine = side;
  }
  // Inside a convex polygon the nearest boundary point lies on the nearest edge line.
  if (inside) return nearestLine;
  let nearest = Number.POSITIVE_INFINITY;
  for (let i = 0; i < size; i += 1) {
    const a = hull[i];
    const b = hull[(i + 1) % size];
    const distance = segmentDistance(xs[a], ys[a], xs[b], ys[b], px, py);
    if (distance < nearest) nearest = distance;
  }
  return -nearest;
}
