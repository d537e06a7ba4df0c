// /export: a gait version's angle table for firmware — choose the version
// (the released one by default), format, units, rate and calibration profile;
// preview the rows; download it; copy the command for the build script.
import { Link } from "react-router";
import { OverrideField, ProfileField, QueryNumberField, SelectField, TableFormatFields } from "~/components/export/TableFormatFields";
import { TableQueryForm, useTableBusy } from "~/components/export/TableQueryForm";
import type { Route } from "./+types/page";
import { ErrorPanel } from "~/components/common/ErrorPanel";
import { EmptyState } from "~/components/common/EmptyState";
import { IssueList } from "~/components/common/IssueList";
import { PageHeader } from "~/components/common/PageHeader";
import { SafetyNotice } from "~/components/export/SafetyNotice";
import { TableResult } from "~/components/export/TableResult";
import { requireAccess } from "~/platform/access.server";
import { config } from "~/platform/config.server";
import { listGaits } from "~/features/gaits/gaits.server";
import { can, type RoutePermissions } from "~/platform/permissions";
import { stateWord } from "~/features/versions/state-labels";
import { exportPageData } from "./page-data.server";

export const permissions = { loader: "tables.download" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireAccess(request, permissions.loader);
  const gaits = await listGaits(member.workspace.id);
  const page = await exportPageData(member.workspace.id, new URL(request.url).searchParams, config().publicUrl, gaits);
  return { ...page, canCalibrate: can(member.role, "robots.calibrate") };
}

export const meta: Route.MetaFunction = () => [{ title: "Export an angle table · Gaitloom" }];

export default function ExportPage({ loaderData }: Route.ComponentProps) {
  const { gaits, gait, version, versions, profiles, query, problem, table, download, release, sequence } = loaderData;
  const busy = useTableBusy();
  if (!gait) {
    return (
      <>
        <PageHeader title="Export an angle table" />
        <EmptyState title="No committed versions yet">Commit a version of a gait first; its table can then be exported here.</EmptyState>
      </>
    );
  }
  return (
    <>
      <PageHeader title="Export an angle table" lead="Per-frame joint angles in servo-channel order, for the firmware to play back.">
        <Link to="/export/bring-up" className="rounded-md border border-line px-3 py-2 text-sm hover:bg-sunken">
          Bring-up tables
        </Link>
        <Link to="/api-docs" className="rounded-md border border-line px-3 py-2 text-sm hover:bg-sunken">
          API
        </Link>
      </PageHeader>
      <SafetyNotice />
      {/* Another gait starts from its own released version, without the old gait's profile. */}
      <TableQueryForm label="Table options" resets="gait" dropped={["version", "profile"]} busy={busy}>
        <SelectField id="export-gait" name="gait" label="Gait" value={gait.id} resetKey={`gait-${gait.id}`} className="col-span-2">
          {gaits.map((entry) => (
            <option key={entry.id} value={entry.id}>
              {entry.name} — {entry.robotName}
              {entry.releasedVersion !== null ? ` (released v${entry.releasedVersion})` : ""}
            </option>
          ))}
        </SelectField>
        <SelectField
          id="export-version"
          name="version"
          label="Version"
          value={String(version)}
          resetKey={`version-${gait.id}-${version}`}
          className="col-span-2"
        >
          {gait.releasedVersion !== null ? <option value="released">Released (currently v{gait.releasedVersion}) — for build scripts</option> : null}
          {versions.map((entry) => (
            <option key={entry.number} value={entry.number}>
              v{entry.number} · {stateWord(entry.state)} · {entry.errors} errors, {entry.warnings} warnings — {entry.message}
            </option>
          ))}
        </SelectField>
        <TableFormatFields idPrefix="export" format={query.format} units={query.units} />
        <QueryNumberField
          id="export-rate"
          name="rate"
          label="Rate (frames/s)"
          min="0.1"
          max="1000"
          value={query.rate ?? ""}
          placeholder={sequence ? `${sequence.fps} (its own)` : ""}
          invalid={problem?.parameter === "rate"}
          help="Another rate solves the gait again; nothing is interpolated."
        />
        <ProfileField idPrefix="export" profiles={profiles} value={query.profile} resetKey={gait.id} invalid={problem?.parameter === "profile"}>
          <Link to={`/export/calibration/${gait.robotId}`} className="mt-1 block text-xs text-accent underline underline-offset-2">
            {loaderData.canCalibrate ? "Edit" : "See"} the calibration profiles of {gait.robotName}
          </Link>
        </ProfileField>
        <OverrideField
          idPrefix="export"
          className="col-span-2 lg:col-span-3"
          value={query.override}
          needed={problem?.needsOverride}
          placeholder="e.g. bench test with the legs free, the support flags do not apply"
          help="Only for a version with error flags or clamped pulses; written into the table's header and the audit log."
        />
      </TableQueryForm>

      {problem ? (
        <div role="alert" className="mt-4 rounded-md border border-danger bg-danger-soft px-4 py-3 text-danger">
          <p className="flex gap-2 font-medium">
            <span aria-hidden="true">✕</span>
            {problem.message}
          </p>
          {problem.issues.length > 0 && !problem.needsOverride ? (
            <IssueList issues={problem.issues.slice(0, 10)} className="mt-1 list-disc pl-8 text-sm" />
          ) : null}
        </div>
      ) : null}

      {table && download ? (
        <TableResult table={table} download={download} busy={busy}>
          {release ? (
            <section aria-labelledby="release-heading" className="rounded-lg border border-line bg-surface p-4 text-sm">
              <h2 id="release-heading" className="mb-1 font-semibold">
                Release record
              </h2>
              <p>
                Released table <code className="font-mono text-xs break-all">{release.tableSha256}</code>, made with exporter {release.exporterVersion} and
                solver {release.solverVersion} from <code className="font-mono text-xs">{release.tableFormat}</code>.
              </p>
              {release.matches === true ? <p className="mt-1 text-ok">✓ This table is the released one, byte for byte.</p> : null}
              {release.matches === false ? (
                <p className="mt-1 text-danger">✕ This table differs from the released one: the exporter or solver changed since.</p>
              ) : null}
              {release.matches === null ? (
                <a href={release.path} className="mt-1 inline-block text-accent underline underline-offset-2">
                  Download the released table as recorded
                </a>
              ) : null}
            </section>
          ) : null}
        </TableResult>
      ) : null}
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPanel error={error} />;
}
