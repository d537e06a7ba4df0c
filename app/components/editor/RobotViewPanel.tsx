// The Robot view at the playhead: the shared top and side views, with the
// editor's own layer over the top view (the shaded support polygon of the
// stance feet, the CoM with its stability margin, and the selected key's foot
// to drag). Geometry comes per frame from a cache kept with the solve.
import { useMemo } from "react";
import { groundRings, SideView, TopView } from "~/components/robot-view";
import { topFrame } from "~/components/robot-view";
import { SOLVE_DEFAULTS } from "~/gait";
import { useEditor } from "~/stores/editor-context";
import { keyPlacesFoot } from "~/features/gaits/editor/key-edits";
import { FootHandle } from "./FootHandle";
import { frameGeometry, type FrameGeometry } from "./frame-geometry";
import { Panel } from "~/components/common/Panel";

export const TOP_VIEW_PX = 360;

function describeFrame(frame: number, geometry: FrameGeometry): string {
  const down = geometry.stanceLegs.length ? geometry.stanceLegs.join(", ") : "none";
  const margin =
    geometry.marginMm === null
      ? "no support polygon (fewer than three feet down)"
      : geometry.marginMm >= 0
        ? `stability margin ${geometry.marginMm.toFixed(1)} mm`
        : `CoM ${(-geometry.marginMm).toFixed(1)} mm outside the support polygon`;
  const trouble = geometry.postures.filter((posture) => !posture.reachable || posture.violations.length > 0).map((posture) => posture.legId);
  return `Frame ${frame}. Feet down: ${down}; ${margin}.${trouble.length ? ` Out of reach or past a limit: ${trouble.join(", ")}.` : ""}`;
}

export function RobotViewPanel() {
  const robot = useEditor((state) => state.robot);
  const preview = useEditor((state) => state.preview);
  const frame = useEditor((state) => state.frame);
  const focusLegId = useEditor((state) => state.focusLegId);
  const bodyHeightMm = useEditor((state) => state.sequence.generator.bodyHeightMm ?? state.robot.standHeight);
  const rings = useMemo(() => groundRings(robot, bodyHeightMm), [robot, bodyHeightMm]);
  const view = useMemo(() => topFrame(robot, TOP_VIEW_PX, TOP_VIEW_PX), [robot]);
  const geometry = preview ? frameGeometry(robot, preview, frame) : null;
  const description = geometry ? describeFrame(frame, geometry) : "No preview: the sequence does not solve.";

  return (
    <Panel
      title="Robot view"
      layout="flex items-baseline justify-between gap-2"
      className="[contain:content]"
      tools={
        <p className="numeric text-sm text-ink-muted" aria-live="off">
          {geometry ? <MarginReadout marginMm={geometry.marginMm} /> : null}
        </p>
      }
    >
      <div className="grid gap-2 p-2">
        <figure className="relative">
          <TopView
            robot={robot}
            postures={geometry?.postures ?? []}
            rings={rings}
            highlightLegId={focusLegId}
            label={`Top view of ${robot.name} at the playhead`}
            description={description}
          />
          <svg viewBox={`0 0 ${TOP_VIEW_PX} ${TOP_VIEW_PX}`} className="pointer-events-none absolute inset-0 h-full w-full">
            {geometry ? <SupportLayer geometry={geometry} view={view} /> : null}
            <FootHandle view={view} />
          </svg>
          <figcaption className="px-1 text-xs text-ink-muted">
            From above, forward up. Shaded: support polygon of the feet down; dashed circle: the stability margin round the CoM.
            <FootHint />
          </figcaption>
        </figure>
        <figure>
          <SideView
            robot={robot}
            postures={geometry?.postures ?? []}
            bodyHeightMm={geometry?.bodyHeightMm ?? bodyHeightMm}
            highlightLegId={focusLegId}
            label={`Side view of ${robot.name} at the playhead, from the right`}
            description={description}
          />
          <figcaption className="px-1 text-xs text-ink-muted">From the right, forward to the right; far-side legs dashed.</figcaption>
        </figure>
      </div>
    </Panel>
  );
}

/** While a key's foot can be moved, the caption says how: with the pointer or the keyboard. */
function FootHint() {
  const legId = useEditor((state) => (state.readOnly ? null : (state.selection?.legId ?? null)));
  const placesFoot = useEditor((state) => (state.selection ? keyPlacesFoot(state.sequence, state.selection) : false));
  if (!legId || !placesFoot) return null;
  return (
    <span className="mt-0.5 block text-ink" data-testid="foot-hint">
      <span aria-hidden>✥ </span>Ringed: the {legId} foot of the selected key. Drag it, or Tab to it and use the arrow keys (Shift: 10 mm).
    </span>
  );
}

function MarginReadout({ marginMm }: { marginMm: number | null }) {
  if (marginMm === null) return <span className="text-warning">◆ fewer than 3 feet down</span>;
  if (marginMm < 0) return <span className="text-danger">▲ CoM outside by {(-marginMm).toFixed(1)} mm</span>;
  if (marginMm < SOLVE_DEFAULTS.marginThresholdMm) return <span className="text-warning">◆ margin {marginMm.toFixed(1)} mm</span>;
  return <span>margin {marginMm.toFixed(1)} mm</span>;
}

function SupportLayer({ geometry, view }: { geometry: FrameGeometry; view: ReturnType<typeof topFrame> }) {
  const [comX, comY] = view.toScreen(geometry.com[0], geometry.com[1]);
  const polygon = geometry.support.map(([x, y]) => view.toScreen(x, y).join(",")).join(" ");
  const margin = geometry.marginMm;
  const tone =
    margin === null ? "stroke-warning" : margin < 0 ? "stroke-danger" : margin < SOLVE_DEFAULTS.marginThresholdMm ? "stroke-warning" : "stroke-accent";
  return (
    <g data-testid="support-layer">
      {polygon ? (
        <polygon
          points={polygon}
          className="fill-accent stroke-accent"
          fillOpacity={0.14}
          strokeWidth={1.5}
          strokeLinejoin="round"
          data-support={geometry.support.length}
        />
      ) : null}
      {margin !== null ? (
        <circle cx={comX} cy={comY} r={Math.max(1, Math.abs(margin) * view.pxPerMm)} className={`${tone} fill-none`} strokeDasharray="4 3" strokeWidth={1.5} />
      ) : null}
      <circle cx={comX} cy={comY} r={3} className="fill-ink" />
    </g>
  );
}
