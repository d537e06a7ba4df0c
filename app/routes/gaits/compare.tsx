import { useCallback, useState } from "react";
import { Link } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/compare";
import { Notice } from "~/components/common/Notice";
import { PageHeader } from "~/components/common/PageHeader";
import { Section } from "~/components/common/Section";
import { ComparePicker } from "~/components/compare/ComparePicker";
import { ComparePlayback } from "~/components/compare/ComparePlayback";
import { JointOverlayPlots } from "~/components/compare/JointOverlayPlots";
import { MetricDeltaTable } from "~/components/compare/MetricDeltaTable";
import { RobotRevisionDiff } from "~/components/compare/RobotRevisionDiff";
import { SequenceDiffTable } from "~/components/compare/SequenceDiffTable";
import { FlagGroupsTable } from "~/components/versions/FlagGroupsTable";
import { StateBadge } from "~/components/versions/StateBadge";
import { formatTime, shortHash } from "~/platform/format";
import { requireAccess } from "~/platform/access.server";
import { attempt, pageGuard } from "~/platform/errors.server";
import { id } from "~/platform/params";
import { compareVersions, listComparableVersions, type Comparison, type ComparedVersion } from "~/features/versions/versions.server";
import type { RoutePermissions } from "~/platform/permissions";

const compareQuery = z.object({
  a: id().optional().catch(undefined),
  b: id().optional().catch(undefined),
});

export const permissions = { loader: "gaits.read" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace } = await requireAccess(request, permissions.loader);
  const search = new URL(request.url).searchParams;
  const query = compareQuery.parse({ a: search.get("a") ?? undefined, b: search.get("b") ?? undefined });
  const versions = await listComparableVersions(workspace.id);
  return pageGuard(async () => {
    let comparison: Comparison | null = null;
    let problem: string | null = null;
    if (query.a && query.b) {
      const { a, b } = query;
      const compared = await attempt(() => compareVersions(workspace.id, a, b));
      // A version that is not there is the page's error; versions that cannot be compared are said beside the picker.
      if (compared.ok) comparison = compared.value;
      else if (compared.refusal.status === 404) throw compared.refusal;
      else problem = compared.refusal.message;
    } else if (search.has("a") || search.has("b")) {
      problem = "Choose two versions, A and B.";
    }
    return { versions, a: query.a ?? null, b: query.b ?? null, comparison, problem };
  });
}

export const meta: Route.MetaFunction = ({ loaderData }) => {
  const comparison = loaderData?.comparison;
  if (!comparison) return [{ title: "Compare versions · Gaitloom" }];
  return [{ title: `${label(comparison.a)} against ${label(comparison.b)} · Gaitloom` }];
};

const label = (version: Pick<ComparedVersion, "gait" | "number">) => `${version.gait.name} v${version.number}`;

function VersionCard({ side, version }: { side: "A" | "B"; version: ComparedVersion }) {
  return (
    <article className="rounded-lg border border-line bg-surface p-3 text-sm" aria-label={`${side}: ${label(version)}`}>
      <div className="flex items-center justify-between gap-2">
        <h2 className="font-semibold">
          <span className="mr-2 rounded bg-sunken px-1.5 py-0.5 font-mono text-xs">{side}</span>
          <Link to={`/gaits/${version.gait.id}/versions/${version.number}`} className="text-accent underline underline-offset-2">
            {label(version)}
          </Link>
        </h2>
        <StateBadge state={version.state} />
      </div>
      <p className="mt-1">“{version.message}”</p>
      <p className="mt-1 text-xs text-ink-muted">
        {version.author?.name ?? "unknown"} · {formatTime(version.createdAt)} · robot revision {version.robotRevision} · hash{" "}
        <span className="font-mono" title={version.contentHash}>
          {shortHash(version.contentHash)}
        </span>
      </p>
    </article>
  );
}

export default function ComparePage({ loaderData }: Route.ComponentProps) {
  const { versions, a, b, comparison, problem } = loaderData;
  const [fraction, setFraction] = useState(0);
  const onFraction = useCallback((value: number) => setFraction(value), []);
  return (
    <>
      <PageHeader
        title="Compare versions"
        lead="Any two versions of one robot's gaits, side by side. The address of this page is the comparison: paste it into a review comment."
      />
      <ComparePicker versions={versions} a={a} b={b} />
      <div className="mt-4">
        <Notice error={problem} />
      </div>
      {comparison ? (
        <div className="mt-4 space-y-8">
          <div className="grid gap-3 md:grid-cols-2">
            <VersionCard side="A" version={comparison.a} />
            <VersionCard side="B" version={comparison.b} />
          </div>
          {comparison.a.contentHash === comparison.b.contentHash ? (
            <p role="status" className="rounded-md bg-sunken px-4 py-2 text-sm">
              <span aria-hidden="true">= </span>A and B have the same content hash: they play exactly the same.
            </p>
          ) : null}
          <Section title="Metric deltas">
            <MetricDeltaTable rows={comparison.metrics} />
          </Section>
          <Section title="Robot views">
            <ComparePlayback
              a={{ label: `A: ${label(comparison.a)}`, robot: comparison.a.robotDefinition, playback: comparison.a.playback }}
              b={{ label: `B: ${label(comparison.b)}`, robot: comparison.b.robotDefinition, playback: comparison.b.playback }}
              onFraction={onFraction}
            />
          </Section>
          <Section title="Joint plots">
            <JointOverlayPlots overlays={comparison.overlays} fraction={fraction} labels={{ a: label(comparison.a), b: label(comparison.b) }} />
          </Section>
          <Section title="Changed keys">
            <SequenceDiffTable diff={comparison.diff} />
          </Section>
          <Section title="Robot revision">
            <RobotRevisionDiff diff={comparison.robotDiff} robotName={comparison.a.gait.robotName} />
          </Section>
          <section aria-labelledby="flags-heading" className="grid gap-4 lg:grid-cols-2">
            <h2 id="flags-heading" className="text-lg font-semibold lg:col-span-2">
              Flagged frames
            </h2>
            <div className="space-y-1">
              <h3 className="text-sm font-medium">A: {label(comparison.a)}</h3>
              <FlagGroupsTable groups={comparison.a.flagGroups} label={`Flags of A, ${label(comparison.a)}`} />
            </div>
            <div className="space-y-1">
              <h3 className="text-sm font-medium">B: {label(comparison.b)}</h3>
              <FlagGroupsTable groups={comparison.b.flagGroups} label={`Flags of B, ${label(comparison.b)}`} />
            </div>
          </section>
        </div>
      ) : !problem ? (
        <p className="mt-6 text-sm text-ink-muted">Choose A and B above, or pick two rows on a gait's page.</p>
      ) : null}
    </>
  );
}

export { RouteErrorBoundary as ErrorBoundary } from "~/components/common/ErrorPanel";
