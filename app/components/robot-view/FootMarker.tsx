import { legFill } from "./leg-colours";

/** A foot: a dot in the leg's colour, or a cross when the leg cannot hold the posture (shape, not only colour). */
export function FootMarker({ x, y, index, flagged }: { x: number; y: number; index: number; flagged: boolean }) {
  if (flagged) {
    return (
      <g className="stroke-danger" strokeWidth={2.5} strokeLinecap="round" data-flag="foot">
        <line x1={x - 5} y1={y - 5} x2={x + 5} y2={y + 5} />
        <line x1={x - 5} y1={y + 5} x2={x + 5} y2={y - 5} />
      </g>
    );
  }
  return <circle cx={x} cy={y} r={4.5} className={`${legFill(index)} stroke-ink`} strokeWidth={1} />;
}
