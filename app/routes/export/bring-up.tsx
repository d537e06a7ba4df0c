// /export/bring-up: bench test tables for a robot on a stand — every servo at
// its centre, or a slow sweep of one chosen joint through its range, checked
// for speed like any gait — in any format and units, with a calibration profile.
import { Form, Link, useNavigation, useSubmit } from "react-router";
import { OverrideField, ProfileField, ShowTableButton, TableFormatFields, fieldClass, labelClass } from "~/components/export/TableFormatFields";
import type { Route } from "./+types/bring-up";
import { EmptyState } from "~/components/common/EmptyState";
import { ErrorPanel } from "~/components/common/ErrorPanel";
import { PageHeader } from "~/components/common/PageHeader";
import { CopyCommand } from "~/components/export/CopyCommand";
import { SafetyNotice } from "~/components/export/SafetyNotice";
import { TableFacts } from "~/components/export/TableFacts";
import { TablePreview } from "~/components/export/TablePreview";
import { requireAccess } from "~/platform/access.server";
import { robotsWithProfiles } from "~/features/robots/calibration.server";
import { config } from "~/platform/config.server";
import { pageGuard } from "~/platform/errors.server";
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
  const submit = useSubmit();
  const navigation = useNavigation();
  const busy = navigation.state === "loading" && navigation.location?.pathname === "/export/bring-up";
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
  const onChange = (event: React.FormEvent<HTMLFormElement>) => {
    const target = event.target as HTMLElement;
    if (target.tagName !== "SELECT" && (target as HTMLInputElement).type !== "radio") return;
    const search = new URLSearchParams();
    const dropped = target.getAttribute("name") === "robot" ? ["leg", "profile"] : [];
    for (const [key, value] of new FormData(event.currentTarget))
      if (typeof value === "string" && value !== "" && !dropped.includes(key)) search.set(key, value);
    submit(search, { method: "get", replace: true, preventScrollReset: true });
  };
  return (
    <>
      <PageHeader title="Bring-up tables" lead="Bench tests for a robot on a stand: centre every servo, then sweep one joint at a time through its range.">
        <Link to="/export" className="rounded-md border border-line px-3 py-2 text-sm hover:bg-sunken">
          Gait tables
        </Link>
      </PageHeader>
      <SafetyNotice />
      <Form
        method="get"
        onChange={onChange}
        aria-label="Bench table options"
        className="grid grid-cols-2 gap-4 rounded-lg border border-line bg-surface p-5 lg:grid-cols-4"
      >
        <div className="col-span-2">
          <label htmlFor="bench-robot" className={labelClass}>
            Robot (newest revision)
          </label>
          <select id="bench-robot" name="robot" defaultValue={robot.id} key={`robot-${robot.id}`} className={fieldClass}>
            {robots.map((entry) => (
              <option key={entry.id} value={entry.id}>
                {entry.name}
              </option>
            ))}
          </select>
        </div>
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
            <div>
              <label htmlFor="bench-leg" className={labelClass}>
                Leg
              </label>
              <select
                id="bench-leg"
                name="leg"
                defaultValue={query.leg ?? ""}
                key={`leg-${robot.id}-${query.leg}`}
                className={fieldClass}
                aria-invalid={problem?.parameter === "leg" || undefined}
              >
                <option value="">Choose…</option>
                {legs.map((entry) => (
                  <option key={entry.id} value={entry.id}>
                    {entry.id}
                  </option>
                ))}
              </select>
            </div>
            <div>
              <label htmlFor="bench-joint" className={labelClass}>
                Joint
              </label>
              <select
                id="bench-joint"
                name="joint"
                defaultValue={query.joint ?? ""}
                key={`joint-${query.joint}`}
                className={fieldClass}
                aria-invalid={problem?.parameter === "joint" || undefined}
              >
                <option value="">Choose…</option>
                <option value="coxa">coxa</option>
                <option value="femur">femur</option>
                <option value="tibia">tibia</option>
              </select>
            </div>
            <div>
              <label htmlFor="bench-speed" className={labelClass}>
                Speed (fraction of the joint's limit)
              </label>
              <input
                id="bench-speed"
                name="speed"
                type="number"
                step="any"
                min="0.01"
                max="10"
                defaultValue={query.speed}
                className={`${fieldClass} text-right`}
              />
            </div>
            <div>
              <label htmlFor="bench-dwell" className={labelClass}>
                Pause at each end (ms)
              </label>
              <input
                id="bench-dwell"
                name="dwell"
                type="number"
                step="1"
                min="0"
                max="10000"
                defaultValue={query.dwell}
                className={`${fieldClass} text-right`}
              />
            </div>
            <div>
              <label htmlFor="bench-hold" className={labelClass}>
                Other joints hold
              </label>
              <select id="bench-hold" name="hold" defaultValue={query.hold} key={`hold-${query.hold}`} className={fieldClass}>
                <option value="stance">the neutral stance</option>
                <option value="centre">0 servo degrees</option>
              </select>
            </div>
          </>
        ) : (
          <div>
            <label htmlFor="bench-seconds" className={labelClass}>
              Hold for (s)
            </label>
            <input
              id="bench-seconds"
              name="seconds"
              type="number"
              step="any"
              min="0.1"
              max="600"
              defaultValue={query.seconds}
              className={`${fieldClass} text-right`}
            />
          </div>
        )}
        <div>
          <label htmlFor="bench-fps" className={labelClass}>
            Rate (frames/s)
          </label>
          <input id="bench-fps" name="fps" type="number" step="any" min="1" max="1000" defaultValue={query.fps} className={`${fieldClass} text-right`} />
        </div>
        <TableFormatFields idPrefix="bench" format={query.format} units={query.units} />
        <ProfileField idPrefix="bench" profiles={profiles} value={query.profile} resetKey={robot.id} />
        <OverrideField
          idPrefix="bench"
          className="col-span-2"
          value={query.override}
          needed={problem?.needsOverride}
          help="Only when the checks find errors; written into the table's header."
        />
        <ShowTableButton busy={busy} />
      </Form>

      {sweep && joint ? (
        <p className="mt-3 text-sm text-ink-muted">
          {leg!.id}.{joint.joint} on channel {joint.channel}: {joint.minDeg}° to {joint.maxDeg}°, limit {joint.maxSpeedDegS}°/s; this sweep moves at{" "}
          <span className="numeric">{Math.round(query.speed * joint.maxSpeedDegS * 10) / 10}</span>°/s.
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
                Peak speed {Math.round(checks.peakSpeedDegS * 10) / 10}°/s of {checks.limitDegS}°/s allowed
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

      {table && download ? (
        <div className="mt-6 grid gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
          <section aria-labelledby="preview-heading" className={`min-w-0 ${busy ? "opacity-60" : ""}`}>
            <div className="mb-2 flex items-center justify-between gap-3">
              <h2 id="preview-heading" className="text-lg font-semibold">
                Preview
              </h2>
              <a href={download.path} download={download.fileName} className="rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong">
                Download {download.fileName}
              </a>
            </div>
            <TablePreview preview={table.preview} />
          </section>
          <aside className="space-y-4">
            <section className="rounded-lg border border-line bg-surface p-4">
              <h2 className="mb-2 font-semibold">In the table's header</h2>
              <TableFacts facts={table.facts} />
            </section>
            <CopyCommand command={download.command} />
          </aside>
        </div>
      ) : null}
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPanel error={error} />;
}
