// What a version is and what its solve found: the pinned robot revision, the
// content hash, timing, travel, stability and the fastest joints.
import type { FlagKind, SolveSummary } from "~/gait/index";
import { peakJointSpeed } from "~/features/compare";
import { FLAG_LABELS } from "~/features/gaits/flag-labels";
import { formatNumber, shortHash } from "~/platform/format";
import { FlagCounts } from "./FlagCounts";

export type VersionFactsProps = {
  version: {
    number: number;
    robotRevision: number;
    contentHash: string;
    errors: number;
    warnings: number;
    summary: Partial<SolveSummary & { cycleMs: number; loop: boolean }>;
  };
};

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="flex flex-col">
      <dt className="text-xs text-ink-muted">{label}</dt>
      <dd className="font-mono text-sm tabular-nums">{children}</dd>
    </div>
  );
}

export function VersionFacts({ version }: VersionFactsProps) {
  const { summary } = version;
  const peak = peakJointSpeed(summary.peakSpeedDegS);
  const kinds = Object.entries(summary.flagsByKind ?? {}).filter(([, count]) => (count ?? 0) > 0) as [FlagKind, number][];
  return (
    <>
      <dl className="mt-3 grid grid-cols-2 gap-x-6 gap-y-3 sm:grid-cols-4">
        <Fact label="Cycle time">{formatNumber(summary.cycleMs, 0, "ms")}</Fact>
        <Fact label="Frames">
          {summary.frames ?? "—"} at {summary.fps ?? "—"} fps{summary.loop === false ? ", one-shot" : ""}
        </Fact>
        <Fact label="Stride">{formatNumber(summary.strideMm, 1, "mm")}</Fact>
        <Fact label="Body speed">{formatNumber(summary.bodySpeedMmS, 1, "mm/s")}</Fact>
        <Fact label="Worst stability margin">
          {formatNumber(summary.worstMarginMm, 1, "mm")}
          {summary.worstMarginFrame !== null && summary.worstMarginFrame !== undefined ? ` (frame ${summary.worstMarginFrame})` : ""}
        </Fact>
        <Fact label="Peak joint speed">{peak ? `${formatNumber(peak.degS, 0, "°/s")} (${peak.legId} ${peak.joint})` : "—"}</Fact>
        <Fact label="Speed headroom">{summary.speedHeadroom ? `${formatNumber(summary.speedHeadroom, 2)}×` : "—"}</Fact>
        <Fact label="Flags">
          <span className="font-sans">
            <FlagCounts errors={version.errors} warnings={version.warnings} />
          </span>
        </Fact>
        <Fact label="Robot revision">{version.robotRevision}</Fact>
        <Fact label="Content hash">
          <span title={version.contentHash}>{shortHash(version.contentHash)}</span>
        </Fact>
      </dl>
      {kinds.length > 0 ? (
        <ul className="mt-3 flex flex-wrap gap-2 text-xs" aria-label="Flags by kind">
          {kinds.map(([kind, count]) => (
            <li key={kind} className="rounded bg-sunken px-2 py-0.5">
              {FLAG_LABELS[kind]}: <span className="font-mono tabular-nums">{count}</span>
            </li>
          ))}
        </ul>
      ) : null}
    </>
  );
}
