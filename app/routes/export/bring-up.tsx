// /export/bring-up: bench test tables for a robot on a stand — every servo at
// its centre, or a slow sweep of one chosen joint through its range, checked
// for speed like any gait — in any format and units, with a calibration profile.
import { Link } from "react-router";
import { OverrideField, ProfileField, QueryNumberField, SelectField, TableFormatFields, labelClass } from "~/components/export/TableFormatFields";
import { TableQueryForm, useTableBusy } from "~/components/export/TableQueryForm";
import type { Route } from "./+types/bring-up";
import { EmptyState } from "~/components/common/EmptyState";
import { ErrorPanel } from "~/components/common/ErrorPanel";
import { PageHeader } from "~/components/common/PageHeader";
import { SafetyNotice } from "~/components/export/SafetyNotice";
import { TableResult } from "~/components/export/TableResult";
import { requireAccess } from "~/platform/access.server";
import { robotsWithProfiles } from "~/features/robots/calibration.server";
import { config } from "~/platform/config.server";
import { pageGuard } from "~/platform/errors.server";
import { formatNumber } from "~/platform/format";
import { benchPageData } from "./page-data.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "tables.download" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireAccess(request, permissions.loader);
  const robots = await robotsWithProfiles(member.workspace.id);
  return pageGuard(() => benchPageData(member.workspace.id, new URL(request.url).searchParams, config().publicUrl, robots));
}

export const meta: Route.MetaFunction = () => [{ title: "Bring-up tables · Gaitloom" }];

export default function BringUp({ loaderData }: Route.ComponentProps) {
  const { robots, robot, legs, profiles, query, problem, table, checks, download } = loaderData;
  const busy = useTableBusy();
  if (!robot) {
    return (
      <>
        <PageHeader title="Bring-up tables" />
        <EmptyState title="No robots yet">Add a robot first.</EmptyState>
      </>
    );
  }
  const sweep = query.kind === "sweep";
  const leg = legs.find((entry) => entry.id === query.leg) ?? null;
  const joint = leg?.joints.find((entry) => entry.joint === query.joint) ?? null;
  // The sweep's speed is measured from its frames, once, and said the same way wherever it is shown: the
  // fraction × the limit is only what was asked, and a stretch in whole frames moves a little slower.
  const peakSpeed = checks?.peakSpeedDegS ?? null;
  return (
    <>
      <PageHeader title="Bring-up tables" lead="Bench tests for a robot on a stand: centre every servo, then sweep one joint at a time through its range.">
        <Link to="/export" className="rounded-md border border-line px-3 py-2 text-sm hover:bg-sunken">
          Gait tables
        </Link>
      </PageHeader>
      <SafetyNotice />
      {/* Another robot starts over without the old robot's leg and profile. */}
      <TableQueryForm label="Bench table options" resets="robot" dropped={["leg", "profile"]} busy={busy}>
        <SelectField id="bench-robot" name="robot" label="Robot (newest revision)" value={robot.id} resetKey={`robot-${robot.id}`} className="col-span-2">
          {robots.map((entry) => (
            <option key={entry.id} value={entry.id}>
              {entry.name}
            </option>
          ))}
        </SelectField>
        <fieldset className="col-span-2">
          <legend className={labelClass}>Table</legend>
          <div className="mt-2 flex gap-6">
            <label className="flex items-center gap-2">
              <input type="radio" name="kind" value="centre" defaultChecked={!sweep} key={`centre-${sweep}`} /> Centre every servo
            </label>
            <label className="flex items-center gap-2">
              <input type="radio" name="kind" value="sweep" defaultChecked={sweep} key={`sweep-${sweep}`} /> Sweep one joint
            </label>
          </div>
        </fieldset>
        {sweep ? (
          <>
            <SelectField
              id="bench-leg"
              name="leg"
              label="Leg"
              value={query.leg ?? ""}
              resetKey={`leg-${robot.id}-${query.leg}`}
              invalid={problem?.parameter === "leg"}
            >
              <option value="">Choose…</option>
              {legs.map((entry) => (
                <option key={entry.id} value={entry.id}>
                  {entry.id}
                </option>
              ))}
            </SelectField>
            <SelectField
              id="bench-joint"
              name="joint"
              label="Joint"
              value={query.joint ?? ""}
              resetKey={`joint-${query.joint}`}
              invalid={problem?.parameter === "joint"}
            >
              <option value="">Choose…</option>
              <option value="coxa">coxa</option>
              <option value="femur">femur</option>
              <option value="tibia">tibia</option>
            </SelectField>
            <QueryNumberField id="bench-speed" name="speed" label="Speed (fraction of the joint's limit)" min="0.01" max="10" value={query.speed} />
            <QueryNumberField id="bench-dwell" name="dwell" label="Pause at each end (ms)" step="1" min="0" max="10000" value={query.dwell} />
            <SelectField id="bench-hold" name="hold" label="Other joints hold" value={query.hold} resetKey={`hold-${query.hold}`}>
              <option value="stance">the neutral stance</option>
              <option value="centre">0 servo degrees</option>
            </SelectField>
          </>
        ) : (
          <QueryNumberField id="bench-seconds" name="seconds" label="Hold for (s)" min="0.1" max="600" value={query.seconds} />
        )}
        <QueryNumberField id="bench-fps" name="fps" label="Rate (frames/s)" min="1" max="1000" value={query.fps} />
        <TableFormatFields idPrefix="bench" format={query.format} units={query.units} />
        <ProfileField idPrefix="bench" profiles={profiles} value={query.profile} resetKey={robot.id} />
        <OverrideField
          idPrefix="bench"
          className="col-span-2"
          value={query.override}
          needed={problem?.needsOverride}
          help="Only when the checks find errors; written into the table's header."
        />
      </TableQueryForm>

      {sweep && joint ? (
        <p className="mt-3 text-sm text-ink-muted">
          {leg!.id}.{joint.joint} on channel {joint.channel}: {joint.minDeg}° to {joint.maxDeg}°, limit {joint.maxSpeedDegS}°/s
          {peakSpeed !== null ? (
            <>
              ; this sweep moves at up to <span className="numeric">{speedText(peakSpeed)}</span>°/s (each stretch takes whole frames, so at most {query.speed}{" "}
              × the limit)
            </>
          ) : null}
          .
        </p>
      ) : null}

      {problem ? (
        <p role="alert" className="mt-4 flex gap-2 rounded-md border border-danger bg-danger-soft px-4 py-3 text-danger">
          <span aria-hidden="true">✕</span>
          {problem.message}
        </p>
      ) : null}

      {checks ? (
        <section aria-labelledby="checks-heading" className="mt-6 rounded-lg border border-line bg-surface p-4">
          <h2 id="checks-heading" className="font-semibold">
            Checks
          </h2>
          <p className="mt-1 text-sm">
            {`${Math.round(checks.durationS * 100) / 100} s long. `}
            {checks.peakSpeedDegS !== null && checks.limitDegS !== null ? (
              <span className={checks.peakSpeedDegS > checks.limitDegS ? "font-medium text-danger" : ""}>
                Peak speed {speedText(checks.peakSpeedDegS)}°/s of {checks.limitDegS}°/s allowed
                {checks.peakSpeedDegS > checks.limitDegS ? " — too fast for this servo" : ""}.
              </span>
            ) : null}
          </p>
          {checks.totalFlags === 0 ? (
            <p className="mt-1 text-sm text-ok">✓ No flags: every joint inside its limits and speed, every pulse inside its servo's range.</p>
          ) : (
            <ul className="mt-2 max-h-48 space-y-0.5 overflow-auto text-sm" aria-label="Flags">
              {checks.flags.map((flag, index) => (
                <li key={index} className={flag.severity === "error" ? "text-danger" : "text-warning"}>
                  <span aria-hidden="true">{flag.severity === "error" ? "✕ " : "△ "}</span>
                  <span className="sr-only">{flag.severity}: </span>
                  frame {flag.frame}, {flag.kind}: {flag.message}
                </li>
              ))}
              {checks.totalFlags > checks.flags.length ? <li className="text-ink-muted">… and {checks.totalFlags - checks.flags.length} more</li> : null}
            </ul>
          )}
        </section>
      ) : null}

      {table && download ? <TableResult table={table} download={download} busy={busy} /> : null}
    </>
  );
}

/** A joint speed as the page shows it: to 0.1°/s. */
const speedText = (degreesPerSecond: number) => formatNumber(degreesPerSecond, 1);

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPanel error={error} />;
}
