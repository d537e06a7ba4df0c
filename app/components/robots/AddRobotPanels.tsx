// The robot list's three ways to add a robot: a new one (copy of another robot
// or the starter template), an uploaded definition, or an imported URDF file.
import { useId } from "react";
import { Form, Link, useNavigation } from "react-router";
import { IssueList } from "~/components/common/IssueList";
import { STARTER_LEG_COUNTS } from "~/features/robots/starter";
import type { AddResult } from "~/features/robots/results";

export type AddPanel = "new" | "upload" | "urdf";

const INTENT_OF: Record<AddPanel, string> = { new: "create", upload: "upload", urdf: "import-urdf" };

const input = "rounded border border-line bg-surface px-2 py-1";
const primary = "rounded-md bg-accent px-4 py-1.5 font-medium text-on-accent hover:bg-accent-strong disabled:opacity-50";

export function AddRobotPanel({
  panel,
  robots,
  result,
}: {
  panel: AddPanel;
  robots: readonly { id: string; name: string; latestRevision: number }[];
  result: AddResult | null;
}) {
  const navigation = useNavigation();
  const busy = navigation.state === "submitting" && navigation.formData?.get("intent") === INTENT_OF[panel];
  const headingId = useId();
  return (
    <section aria-labelledby={headingId} className="mb-6 rounded-lg border border-line bg-surface p-5">
      {panel === "new" ? (
        <>
          <h2 id={headingId} className="text-lg font-semibold">
            New robot
          </h2>
          <p className="mt-1 text-sm text-ink-muted">Start from a copy of a robot you have, or from a plain template to measure and fill in.</p>
          <Form method="post" className="mt-4 flex flex-wrap items-end gap-4">
            <input type="hidden" name="intent" value="create" />
            <label className="flex flex-col gap-1 text-sm">
              Name
              <input name="name" required maxLength={120} autoComplete="off" className={`${input} w-64`} />
            </label>
            <label className="flex flex-col gap-1 text-sm">
              Start from
              <select name="source" className={input} defaultValue={robots[0] ? `robot-${robots[0].id}` : "starter-6"}>
                <optgroup label="A copy of">
                  {robots.map((robot) => (
                    <option key={robot.id} value={`robot-${robot.id}`}>
                      {robot.name} (revision {robot.latestRevision})
                    </option>
                  ))}
                </optgroup>
                <optgroup label="The starter template">
                  {STARTER_LEG_COUNTS.map((count) => (
                    <option key={count} value={`starter-${count}`}>
                      {count} legs
                    </option>
                  ))}
                </optgroup>
              </select>
            </label>
            <button type="submit" className={primary} disabled={busy}>
              {busy ? "Creating…" : "Create robot"}
            </button>
          </Form>
        </>
      ) : panel === "upload" ? (
        <>
          <h2 id={headingId} className="text-lg font-semibold">
            Upload a robot definition
          </h2>
          <p className="mt-1 text-sm text-ink-muted">
            A JSON file in the <code className="font-mono">gaitloom.robot/1</code> format, up to 256 KB (
            <a href="/api/v1/schema/robot.json" className="text-accent underline underline-offset-2">
              JSON Schema
            </a>
            ). It is checked first; nothing is saved unless it is valid.
          </p>
          <Form method="post" encType="multipart/form-data" className="mt-4 flex flex-wrap items-end gap-4">
            <input type="hidden" name="intent" value="upload" />
            <label className="flex flex-col gap-1 text-sm">
              Definition file (JSON)
              <input type="file" name="file" required accept=".json,application/json" className="text-sm" />
            </label>
            <label className="flex flex-col gap-1 text-sm">
              Name (empty: the file&apos;s)
              <input name="name" maxLength={120} autoComplete="off" className={`${input} w-56`} />
            </label>
            <button type="submit" className={primary} disabled={busy}>
              {busy ? "Checking…" : "Upload and create"}
            </button>
          </Form>
        </>
      ) : (
        <>
          <h2 id={headingId} className="text-lg font-semibold">
            Import a URDF file
          </h2>
          <p className="mt-1 text-sm text-ink-muted">
            Each leg must be a chain of three revolute joints (coxa, femur, tibia) from the base link, ending in a fixed joint at the foot tip. What URDF does
            not hold (servo mapping, standing height) gets defaults, listed after the import.
          </p>
          <Form method="post" encType="multipart/form-data" className="mt-4 flex flex-wrap items-end gap-4">
            <input type="hidden" name="intent" value="import-urdf" />
            <label className="flex flex-col gap-1 text-sm">
              URDF file
              <input type="file" name="file" required accept=".urdf,.xml,application/xml,text/xml" className="text-sm" />
            </label>
            <label className="flex flex-col gap-1 text-sm">
              Name (empty: the URDF robot&apos;s)
              <input name="name" maxLength={120} autoComplete="off" className={`${input} w-56`} />
            </label>
            <button type="submit" className={primary} disabled={busy}>
              {busy ? "Importing…" : "Import and create"}
            </button>
          </Form>
        </>
      )}
      {/* Only the open panel can post, and opening another is a navigation, which drops the answer: any answer is this panel's. */}
      {result ? <AddAnswer result={result} /> : null}
    </section>
  );
}

function AddAnswer({ result }: { result: AddResult }) {
  if ("ok" in result) {
    return (
      <div role="status" className="mt-4 rounded-md border border-ok bg-ok-soft p-4 text-sm">
        <p className="font-semibold text-ok">
          ✓ Created{" "}
          <Link to={`/robots/${result.robotId}`} className="underline underline-offset-2">
            {result.name}
          </Link>{" "}
          from the URDF file.
        </p>
        <ImportReport lines={result.report} />
      </div>
    );
  }
  return (
    <div role="alert" className="mt-4 rounded-md border border-danger bg-danger-soft p-4 text-sm">
      <p className="font-semibold text-danger">
        <span aria-hidden>⚠ </span>
        {result.error}
      </p>
      {result.details?.issues?.length ? (
        <IssueList issues={result.details.issues} whole="(the whole file)" className="mt-2 space-y-1" aria-label="Problems found" />
      ) : null}
      {result.details?.report?.length ? <ImportReport lines={result.details.report} /> : null}
    </div>
  );
}

function ImportReport({ lines }: { lines: readonly string[] }) {
  return (
    <details open className="mt-2">
      <summary className="cursor-pointer font-medium">What was mapped ({lines.length} notes)</summary>
      <ul className="mt-1 list-inside list-disc space-y-0.5 text-ink">
        {lines.map((line, index) => (
          <li key={index}>{line}</li>
        ))}
      </ul>
    </details>
  );
}
