// A version's flags grouped by kind, leg and joint, with the frames they fall on.
import type { FlagGroup } from "~/features/compare";
import { FLAG_LABELS } from "~/features/gaits/flag-labels";
import { FramedTable, type Column } from "~/components/common/FramedTable";

const COLUMNS: readonly Column[] = [
  { label: "Check" },
  { label: "Where" },
  { label: "Frames", align: "right" },
  { label: "Frame numbers" },
  { label: "Worst" },
];

export function FlagGroupsTable({ groups, label = "Flags of this version" }: { groups: readonly FlagGroup[]; label?: string }) {
  if (groups.length === 0) {
    return (
      <p className="rounded-lg border border-line bg-ok-soft px-4 py-3 text-sm text-ok">
        <span aria-hidden="true">✓ </span>No flags: every frame is within reach, limits, speed and support.
      </p>
    );
  }
  return (
    <FramedTable label={label} columns={COLUMNS}>
      {groups.map((group) => (
        <tr key={`${group.kind}-${group.leg}-${group.joint}-${group.severity}`} className="border-b border-line align-top last:border-0">
          <td className="px-3 py-2 whitespace-nowrap">
            <span className={group.severity === "error" ? "text-danger" : "text-warning"}>
              <span aria-hidden="true">{group.severity === "error" ? "✕ " : "▲ "}</span>
              <span className="sr-only">{group.severity}: </span>
            </span>
            {FLAG_LABELS[group.kind]}
          </td>
          <td className="px-3 py-2 font-mono whitespace-nowrap">{[group.leg, group.joint].filter(Boolean).join(" ") || "body"}</td>
          <td className="px-3 py-2 text-right font-mono tabular-nums">{group.count}</td>
          <td className="max-w-48 px-3 py-2 font-mono text-xs break-words tabular-nums">{group.frames}</td>
          <td className="px-3 py-2 text-xs text-ink-muted">{group.example}</td>
        </tr>
      ))}
    </FramedTable>
  );
}
