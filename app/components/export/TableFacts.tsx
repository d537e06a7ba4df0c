// What a table says about itself: the header's metadata, flags and the file.
export type TableFactsData = {
  robot: { name: string; revision: number | string };
  gait: { name: string; version: number | string; contentHash: string };
  rateHz: number;
  framePeriodMs: number;
  frameCount: number;
  channelCount: number;
  units: string;
  calibrationProfile: string | null;
  overrideReason: string | null;
  flags: { errors: number; warnings: number; byKind: Record<string, number | undefined> };
  clampedCount: number;
  exporterVersion: string;
  solverVersion: string | null;
  fileName: string;
  bytes: number;
  sha256: string;
};

const kib = (bytes: number) => (bytes < 1024 ? `${bytes} B` : `${(bytes / 1024).toFixed(1)} KiB`);

export function TableFacts({ facts }: { facts: TableFactsData }) {
  const rows: [string, React.ReactNode][] = [
    ["Robot", `${facts.robot.name}, revision ${facts.robot.revision}`],
    ["Gait", `${facts.gait.name}, version ${facts.gait.version}`],
    ["Content hash", <code className="font-mono text-xs break-all">{facts.gait.contentHash}</code>],
    [
      "Frames",
      <span className="numeric">{`${facts.frameCount} at ${facts.rateHz} Hz (${facts.framePeriodMs} ms apart), ${facts.channelCount} channels`}</span>,
    ],
    ["Calibration profile", facts.calibrationProfile ?? "none (the robot's own servo settings)"],
    [
      "Flags",
      facts.flags.errors + facts.flags.warnings === 0
        ? "none"
        : `${facts.flags.errors} errors, ${facts.flags.warnings} warnings (${Object.entries(facts.flags.byKind)
            .map(([kind, count]) => `${kind} ${count}`)
            .join(", ")})`,
    ],
    ["Clamped pulses", facts.clampedCount === 0 ? "none" : `${facts.clampedCount} cells clamped to the servo range`],
    ...(facts.overrideReason ? ([["Override", facts.overrideReason]] as [string, React.ReactNode][]) : []),
    ["File", <span className="break-all">{`${facts.fileName} · ${kib(facts.bytes)}`}</span>],
    ["SHA-256", <code className="font-mono text-xs break-all">{facts.sha256}</code>],
    ["Made by", `exporter ${facts.exporterVersion}, solver ${facts.solverVersion ?? "—"}`],
  ];
  return (
    <dl className="grid grid-cols-[9rem_1fr] gap-x-4 gap-y-1 text-sm">
      {rows.map(([term, value]) => (
        <div key={term} className="contents">
          <dt className="text-ink-muted">{term}</dt>
          {/* A long file name breaks where it must instead of widening the page. */}
          <dd className="min-w-0 [overflow-wrap:anywhere]">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
