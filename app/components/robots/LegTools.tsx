// Mirror one side onto the other, copy one leg's geometry to others, add a leg.
// All in the browser on the working copy; nothing is saved until Save.
import { useId, useState } from "react";
import { legSide, MAX_LEGS, type Robot } from "~/kinematics";
import { addLeg, copyGeometryTo, mirrorSide } from "~/features/robots/leg-tools";

const button = "rounded-md border border-line bg-surface px-3 py-1.5 text-sm font-medium hover:bg-sunken disabled:cursor-not-allowed disabled:opacity-50";

export function LegTools({ robot, onApply }: { robot: Robot | null; onApply: (next: Robot, note: string) => void }) {
  const [source, setSource] = useState<string>("");
  const [targets, setTargets] = useState<string[] | null>(null);
  const headingId = useId();
  const disabled = robot === null;
  const sourceId = robot?.legs.some((leg) => leg.id === source) ? source : (robot?.legs[0]?.id ?? "");
  const chosenTargets = targets ?? robot?.legs.filter((leg) => leg.id !== sourceId).map((leg) => leg.id) ?? [];

  const mirror = (from: "left" | "right") => {
    if (!robot) return;
    const result = mirrorSide(robot, from);
    const to = from === "left" ? "right" : "left";
    const parts = [
      result.replaced.length > 0 ? `replaced ${result.replaced.join(", ")} (ids and servo mappings kept)` : null,
      result.added.length > 0 ? `added ${result.added.join(", ")} on free channels` : null,
    ].filter(Boolean);
    onApply(result.robot, parts.length > 0 ? `Mirrored the ${from} legs onto the ${to} side: ${parts.join("; ")}.` : `No ${from} legs to mirror.`);
  };

  return (
    <section aria-labelledby={headingId} className="space-y-3 rounded-lg border border-line bg-surface p-4">
      <h3 id={headingId} className="text-sm font-semibold">
        Leg tools
      </h3>
      {disabled ? <p className="text-sm text-ink-muted">Fix the problems listed above to use the leg tools.</p> : null}
      <div className="flex flex-wrap gap-2">
        <button type="button" className={button} disabled={disabled} onClick={() => mirror("left")}>
          Mirror left → right
        </button>
        <button type="button" className={button} disabled={disabled} onClick={() => mirror("right")}>
          Mirror right → left
        </button>
        <button
          type="button"
          className={button}
          disabled={disabled || (robot?.legs.length ?? MAX_LEGS) >= MAX_LEGS}
          onClick={() => {
            const next = robot && addLeg(robot);
            if (next) onApply(next, `Added leg ${next.legs[next.legs.length - 1].id}, a copy of ${robot.legs[robot.legs.length - 1].id} 30 mm further back.`);
          }}
        >
          Add a leg
        </button>
      </div>
      <fieldset className="space-y-2" disabled={disabled}>
        <legend className="text-sm font-medium">Copy a leg&apos;s lengths, limits, offsets and speeds to other legs</legend>
        <div className="flex flex-wrap items-center gap-3 text-sm">
          <label className="flex items-center gap-2">
            From
            <select
              value={sourceId}
              onChange={(event) => {
                setSource(event.currentTarget.value);
                setTargets(null);
              }}
              className="rounded border border-line bg-surface px-1.5 py-0.5 font-mono"
            >
              {robot?.legs.map((leg) => (
                <option key={leg.id} value={leg.id}>
                  {leg.id}
                </option>
              ))}
            </select>
          </label>
          <span className="text-ink-muted">to</span>
          {robot?.legs
            .filter((leg) => leg.id !== sourceId)
            .map((leg) => (
              <label key={leg.id} className="flex items-center gap-1 font-mono">
                <input
                  type="checkbox"
                  className="h-4 w-4 accent-accent"
                  checked={chosenTargets.includes(leg.id)}
                  onChange={(event) => {
                    const checked = event.currentTarget.checked;
                    setTargets(checked ? [...chosenTargets, leg.id] : chosenTargets.filter((id) => id !== leg.id));
                  }}
                />
                {leg.id}
              </label>
            ))}
          <button
            type="button"
            className={button}
            disabled={disabled || chosenTargets.length === 0}
            onClick={() => {
              if (!robot) return;
              const source = robot.legs.find((leg) => leg.id === sourceId);
              const mirrored = source
                ? chosenTargets.filter(
                    (id) =>
                      legSide(
                        robot,
                        robot.legs.find((leg) => leg.id === id)!,
                      ) !== legSide(robot, source),
                  )
                : [];
              onApply(
                copyGeometryTo(robot, sourceId, chosenTargets),
                `Copied ${sourceId} to ${chosenTargets.join(", ")}${mirrored.length > 0 ? ` (mirrored for ${mirrored.join(", ")} on the other side)` : ""}; mounts and servo mappings kept.`,
              );
            }}
          >
            Copy
          </button>
        </div>
      </fieldset>
    </section>
  );
}
