// The key-by-key diff of A's and B's sequences: settings that changed, then
// per track the keys added, removed, moved or otherwise changed. Unchanged
// keys are folded away.
import { describeKeyChanges, type KeyDiff, type SequenceDiff } from "~/features/compare";
import { describeSettingChange } from "~/features/gaits";
import { FramedTable, type Column } from "~/components/common/FramedTable";

const STATUS_LOOKS: Record<KeyDiff["status"], { mark: string; label: string; className: string }> = {
  added: { mark: "+", label: "Added", className: "bg-ok-soft text-ok" },
  removed: { mark: "−", label: "Removed", className: "bg-danger-soft text-danger" },
  changed: { mark: "~", label: "Changed", className: "bg-warning-soft text-warning" },
  same: { mark: "=", label: "Same", className: "bg-sunken text-ink-muted" },
};

const KEY_COLUMNS: readonly Column[] = [{ label: "Track" }, { label: "Key" }, { label: "What" }, { label: "In A" }, { label: "In B" }];

const round = (value: number) => (Math.round(value * 10) / 10).toFixed(1);

function keyText(key: KeyDiff["a"]): string {
  if (!key) return "—";
  const k = key.key as { t: number; contact?: string; foot?: number[]; pose?: Record<string, number> };
  const parts = [`t ${k.t.toFixed(3)}`];
  if (k.contact) parts.push(k.contact);
  if (k.foot) parts.push(`[${k.foot.map(round).join(", ")}]`);
  if (k.pose) {
    const moved = Object.entries(k.pose).filter(([, value]) => value !== 0);
    parts.push(moved.length > 0 ? moved.map(([field, value]) => `${field} ${round(value)}`).join(" ") : "neutral");
  }
  return parts.join(" · ");
}

function countsText(counts: SequenceDiff["counts"]): string {
  return [
    `${counts.added} added`,
    `${counts.removed} removed`,
    `${counts.moved} moved`,
    `${counts.easing} with changed easing`,
    `${counts.changed} changed in all`,
    `${counts.same} unchanged`,
  ].join(", ");
}

export function SequenceDiffTable({ diff }: { diff: SequenceDiff }) {
  const changedTracks = diff.tracks.filter((track) => track.keys.some((key) => key.status !== "same"));
  return (
    <div className="space-y-3">
      <p className="text-sm" data-testid="diff-counts">
        Keys: {countsText(diff.counts)}.
      </p>
      {diff.settings.length > 0 ? (
        <div className="rounded-lg border border-line bg-surface px-4 py-3 text-sm">
          <h3 className="font-medium">Settings</h3>
          <ul className="mt-1 list-inside list-disc">
            {diff.settings.map((change) => (
              <li key={change.path} title={change.path}>
                {describeSettingChange(change)}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {changedTracks.length === 0 ? (
        <p className="rounded-lg border border-line bg-surface px-4 py-3 text-sm text-ink-muted">Every key of A is in B, unchanged.</p>
      ) : (
        <FramedTable label="Changed keys" columns={KEY_COLUMNS}>
          {changedTracks.flatMap((track) =>
            track.keys
              .filter((key) => key.status !== "same")
              .map((key, index) => {
                const look = STATUS_LOOKS[key.status];
                return (
                  <tr key={`${track.track}-${index}`} className="border-b border-line align-top last:border-0" data-status={key.status}>
                    <td className="px-3 py-1.5 font-mono">
                      {track.track}
                      {track.presence !== "both" ? (
                        <span className="ml-1 font-sans text-xs text-ink-muted">({track.presence === "only-a" ? "only in A" : "only in B"})</span>
                      ) : null}
                    </td>
                    <td className="px-3 py-1.5 whitespace-nowrap">
                      <span className={`inline-flex items-center gap-1 rounded px-1.5 py-0.5 text-xs ${look.className}`}>
                        <span aria-hidden="true">{look.mark}</span>
                        {look.label}
                      </span>
                    </td>
                    <td className="px-3 py-1.5">
                      {key.status === "changed" ? describeKeyChanges(key.changes) : key.status === "added" ? "new key" : "key taken out"}
                    </td>
                    <td className="px-3 py-1.5 font-mono text-xs tabular-nums">{keyText(key.a)}</td>
                    <td className="px-3 py-1.5 font-mono text-xs tabular-nums">{keyText(key.b)}</td>
                  </tr>
                );
              }),
          )}
        </FramedTable>
      )}
    </div>
  );
}
