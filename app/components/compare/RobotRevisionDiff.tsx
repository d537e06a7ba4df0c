// When A and B pin different revisions of the robot: which fields changed.
import type { RobotRevisionDiff as Diff } from "~/features/compare";

export function RobotRevisionDiff({ diff, robotName }: { diff: Diff | null; robotName: string }) {
  if (!diff) {
    return <p className="text-sm text-ink-muted">A and B pin the same revision of {robotName}.</p>;
  }
  return (
    <div className="rounded-lg border border-line bg-surface px-4 py-3 text-sm">
      <p>
        A pins {robotName} revision <span className="font-mono">{diff.a}</span>, B pins revision <span className="font-mono">{diff.b}</span>:{" "}
        {diff.changes.length === 0 ? "their definitions are the same." : `${diff.changes.length} field${diff.changes.length === 1 ? "" : "s"} changed.`}
      </p>
      {diff.described.length > 0 ? (
        <ul className="mt-2 max-h-64 list-inside list-disc overflow-auto font-mono text-xs" aria-label="Changed robot fields">
          {diff.described.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
