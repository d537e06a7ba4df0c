// Where the top view writes each leg's name: beside its foot, on the side away
// from the body, and pushed apart where two would overlap (feet drawn close
// together, or a crowded eight-legged robot). Screen coordinates, y down; a
// label's y is its baseline. Pure, so the placement is tested on its own.

/** Room a character of the 11 px label takes, generously. */
const CHARACTER_PX = 7.5;
const HEIGHT_PX = 12;
const FOOT_GAP_PX = 9;
const MAX_ROUNDS = 200;

export type LegLabelInput = { id: string; text: string; foot: readonly [number, number] };
export type PlacedLegLabel = { id: string; text: string; x: number; y: number; anchor: "start" | "end" };

/** The box a placed label covers. */
export function labelBox(label: PlacedLegLabel): { left: number; right: number; top: number; bottom: number } {
  const width = label.text.length * CHARACTER_PX;
  const left = label.anchor === "start" ? label.x : label.x - width;
  return { left, right: left + width, top: label.y - HEIGHT_PX + 2, bottom: label.y + 2 };
}

export function placeLegLabels(inputs: readonly LegLabelInput[], centre: readonly [number, number]): PlacedLegLabel[] {
  const labels = inputs.map((input) => {
    const dx = input.foot[0] - centre[0];
    const dy = input.foot[1] - centre[1];
    const length = Math.hypot(dx, dy) || 1;
    const anchor: PlacedLegLabel["anchor"] = dx >= 0 ? "start" : "end";
    return {
      id: input.id,
      text: input.text,
      anchor,
      x: input.foot[0] + (anchor === "start" ? FOOT_GAP_PX : -FOOT_GAP_PX),
      // Centred on a point a little outward from the foot.
      y: input.foot[1] + (dy / length) * FOOT_GAP_PX + HEIGHT_PX / 2 - 2,
    };
  });
  // Push overlapping labels apart, the lower one down (or the upper one up when it is the higher in the list), until none overlap.
  for (let round = 0; round < MAX_ROUNDS; round += 1) {
    let moved = false;
    const order = [...labels].sort((a, b) => a.y - b.y);
    for (let i = 0; i < order.length; i += 1) {
      for (let j = i + 1; j < order.length; j += 1) {
        const upper = labelBox(order[i]);
        const lower = labelBox(order[j]);
        if (upper.left >= lower.right || lower.left >= upper.right || upper.top >= lower.bottom || lower.top >= upper.bottom) continue;
        const overlap = upper.bottom - lower.top + 1;
        order[i].y -= overlap / 2;
        order[j].y += overlap / 2;
        moved = true;
      }
    }
    if (!moved) break;
  }
  return labels;
}
