// A released version's table beside the one its release recorded: the same
// bytes today, or not and why (DESIGN.md: "a version page says when today's
// table differs from its recorded hash").
import { formatTime, shortHash } from "~/platform/format";
import { Section } from "~/components/common/Section";

export type ReleaseTableCheckData = {
  recorded: { sha256: string; exporterVersion: string; solverVersion: string; tableFormat: string; createdAt: Date | string };
  today: { sha256: string | null; exporterVersion: string; solverVersion: string; problem: string | null };
  matches: boolean;
  reasons: string[];
  /** Today's table from the recorded query, for those who may download tables; null otherwise. */
  downloadPath: string | null;
};

function Hash({ sha256 }: { sha256: string | null }) {
  if (!sha256) return <>—</>;
  return (
    <code className="font-mono text-xs" title={sha256}>
      {shortHash(sha256)}
    </code>
  );
}

export function ReleaseTableCheck({ check }: { check: ReleaseTableCheckData }) {
  const { recorded, today } = check;
  return (
    <Section title="Release table" className="space-y-2 rounded-lg border border-line bg-surface p-4 text-sm">
      {" "}
      {check.matches ? (
        <p className="flex gap-2 text-ok">
          <span aria-hidden="true">✓</span>
          Today's table is the one recorded at the release, byte for byte.
        </p>
      ) : (
        <div data-testid="release-table-differs" className="rounded-md border border-warning bg-warning-soft px-3 py-2 text-ink">
          <p className="flex gap-2 font-medium">
            <span aria-hidden="true" className="text-warning">
              ⚠
            </span>
            Today's table differs from the one recorded at the release.
          </p>
          <p className="mt-1">
            {today.problem
              ? `It cannot be made again today: ${today.problem}`
              : check.reasons.length > 0
                ? `Since the release, ${check.reasons.join(" and ")}, so the same query now gives other bytes. Check today's table on the stand before it replaces the one on the robot.`
                : "The exporter and solver are the versions recorded, yet the bytes differ: tell the team that keeps Gaitloom running."}
          </p>
        </div>
      )}
      <dl className="mt-3 grid grid-cols-[7rem_1fr] gap-x-3 gap-y-1">
        <dt className="text-ink-muted">Recorded</dt>
        <dd>
          <Hash sha256={recorded.sha256} /> · exporter {recorded.exporterVersion}, solver {recorded.solverVersion} · {formatTime(recorded.createdAt)}
        </dd>
        <dt className="text-ink-muted">Today</dt>
        <dd>
          <Hash sha256={today.sha256} /> · exporter {today.exporterVersion}, solver {today.solverVersion}
        </dd>
        <dt className="text-ink-muted">Query</dt>
        <dd>
          <code className="font-mono text-xs break-all">{recorded.tableFormat}</code>
        </dd>
      </dl>
      {check.downloadPath ? (
        <a href={check.downloadPath} className="mt-2 inline-block text-accent underline underline-offset-2">
          Download today's table
        </a>
      ) : null}
    </Section>
  );
}
