// /gaits/new: pick a robot, a template that suits it and the generator
// parameters; the gait is created with that draft and opens in the editor.
// Also takes the "keep mine as a copy" post from the editor (intent=copy).
import { useMemo, useState } from "react";
import { Form, Link, redirect, useNavigation } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/new";
import { decimalInput } from "~/components/common/decimal-input";
import { Notice } from "~/components/common/Notice";
import { PageHeader } from "~/components/common/PageHeader";
import { requireAccess } from "~/platform/access.server";
import { readForm } from "~/platform/body.server";
import { permissionOfEveryIntent } from "~/platform/intent-form.server";
import { copyForm, createGait, createGaitCopy, newGaitForm, robotChoices } from "~/features/gaits/new-gait.server";
import { DEFAULT_PARAMS } from "~/features/gaits/editor/templates";
import { formAction, ServiceError } from "~/platform/errors.server";
import type { RoutePermissions } from "~/platform/permissions";

/** A new gait from a template (this page's form), or someone's edits kept as a copy (the editor's). */
export const actionForm = z.object({ intent: z.enum(["create", "copy"], { error: 'intent must be "create" or "copy"' }) });

export const permissions = { loader: "gaits.edit", action: { create: "gaits.edit", copy: "gaits.edit" } } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace } = await requireAccess(request, permissions.loader);
  const robots = await robotChoices(workspace.id);
  const wanted = new URL(request.url).searchParams.get("robot");
  return { robots, robotId: robots.find((robot) => robot.id === wanted)?.id ?? robots[0]?.id ?? null };
}

export async function action({ request }: Route.ActionArgs) {
  const { user, workspace } = await requireAccess(request, permissionOfEveryIntent(permissions.action));
  const actor = { userId: user.id, workspaceId: workspace.id };
  return formAction(async () => {
    const form = Object.fromEntries(await readForm(request));
    const intent = actionForm.safeParse(form);
    if (!intent.success) throw new ServiceError(400, "bad-request", intent.error.issues[0].message);
    if (intent.data.intent === "copy") {
      const parsed = copyForm.safeParse(form);
      if (!parsed.success) throw new ServiceError(422, "invalid", parsed.error.issues[0].message, { field: String(parsed.error.issues[0].path[0] ?? "") });
      return redirect(`/gaits/${(await createGaitCopy(actor, parsed.data)).id}/edit`);
    }
    const parsed = newGaitForm.safeParse(form);
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      const field = String(issue.path[0] ?? "");
      throw new ServiceError(422, "invalid", `${FIELD_LABELS[field] ?? field}: ${issue.message}`, { field });
    }
    return redirect(`/gaits/${(await createGait(actor, parsed.data)).id}/edit`);
  });
}

export const meta: Route.MetaFunction = () => [{ title: "New gait · Gaitloom" }];

const FIELD_LABELS: Record<string, string> = {
  robotId: "Robot",
  name: "Name",
  description: "Description",
  template: "Template",
  cycleMs: "Cycle time (ms)",
  fps: "Frame rate (frames/s)",
  strideMm: "Stride (mm)",
  stepHeightMm: "Step height (mm)",
  directionDeg: "Direction (°)",
  turnDegPerCycle: "Turn per cycle (°)",
  bodyHeightMm: "Body height (mm)",
  dutyFactor: "Duty factor",
};

const inputClass = "w-full rounded-md border border-line bg-surface px-2 py-1.5 focus-visible:border-accent";

function NumberInput({
  name,
  placeholder,
  defaultValue,
  error,
  hint,
}: {
  name: string;
  placeholder?: string;
  defaultValue?: number;
  error?: boolean;
  hint?: string;
}) {
  const id = `new-gait-${name}`;
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium">
        {FIELD_LABELS[name]}
      </label>
      <input
        id={id}
        name={name}
        {...decimalInput}
        defaultValue={defaultValue}
        placeholder={placeholder}
        aria-invalid={error || undefined}
        aria-describedby={hint ? `${id}-hint` : undefined}
        className={`${inputClass} text-right font-mono tabular-nums ${error ? "border-danger" : ""}`}
      />
      {hint ? (
        <p id={`${id}-hint`} className="mt-0.5 text-xs text-ink-muted">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

export default function NewGait({ loaderData, actionData }: Route.ComponentProps) {
  const { robots } = loaderData;
  const [robotId, setRobotId] = useState(loaderData.robotId ?? "");
  const robot = useMemo(() => robots.find((candidate) => candidate.id === robotId) ?? robots[0], [robots, robotId]);
  const [template, setTemplate] = useState(robot?.templates[0]?.name ?? "");
  const navigation = useNavigation();
  const busy = navigation.state !== "idle";
  const error = actionData && "error" in actionData ? actionData : null;
  const chosen = robot?.templates.find((candidate) => candidate.name === template) ?? robot?.templates[0];

  if (!robot) {
    return (
      <>
        <PageHeader title="New gait" />
        <Notice error="There is no robot in this workspace yet." />
        <Link to="/robots" className="text-accent underline underline-offset-4">
          Add a robot first
        </Link>
      </>
    );
  }
  return (
    <>
      <PageHeader title="New gait" lead="Start from a template; every key it writes can be changed in the editor." />
      <Notice error={error?.error} />
      <Form method="post" className="grid max-w-3xl gap-6 rounded-lg border border-line bg-surface p-6">
        <input type="hidden" name="intent" value="create" />
        <div className="grid gap-4 sm:grid-cols-2">
          <div>
            <label htmlFor="new-gait-robotId" className="block text-sm font-medium">
              Robot
            </label>
            <select
              id="new-gait-robotId"
              name="robotId"
              value={robot.id}
              onChange={(event) => {
                setRobotId(event.currentTarget.value);
                const next = robots.find((candidate) => candidate.id === event.currentTarget.value);
                if (next && !next.templates.some((candidate) => candidate.name === template)) setTemplate(next.templates[0]?.name ?? "");
              }}
              className={inputClass}
            >
              {robots.map((candidate) => (
                <option key={candidate.id} value={candidate.id}>
                  {candidate.name} — {candidate.legCount} legs, revision {candidate.revision}
                </option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor="new-gait-name" className="block text-sm font-medium">
              Name
            </label>
            <input
              id="new-gait-name"
              name="name"
              required
              maxLength={120}
              autoComplete="off"
              aria-invalid={error?.field === "name" || undefined}
              className={inputClass}
            />
          </div>
        </div>
        <fieldset>
          <legend className="text-sm font-medium">Template (for {robot.legCount} legs)</legend>
          <div className="mt-2 grid gap-2 sm:grid-cols-2">
            {robot.templates.map((candidate) => (
              <label
                key={candidate.name}
                className="flex cursor-pointer items-start gap-2 rounded-md border border-line px-3 py-2 has-[:checked]:border-accent has-[:checked]:bg-accent-soft"
              >
                <input
                  type="radio"
                  name="template"
                  value={candidate.name}
                  checked={chosen?.name === candidate.name}
                  onChange={() => setTemplate(candidate.name)}
                  className="mt-1 accent-accent"
                />
                <span>
                  <span className="block font-mono text-sm">{candidate.name}</span>
                  <span className="block text-sm text-ink-muted">{candidate.label}</span>
                  {candidate.dutyFactor !== null ? (
                    <span className="numeric block text-xs text-ink-muted">duty factor {candidate.dutyFactor.toFixed(3)}</span>
                  ) : null}
                </span>
              </label>
            ))}
          </div>
        </fieldset>
        <fieldset>
          <legend className="text-sm font-medium">Generator parameters</legend>
          <div className="mt-2 grid gap-4 sm:grid-cols-4">
            <NumberInput name="cycleMs" defaultValue={DEFAULT_PARAMS.cycleMs} error={error?.field === "cycleMs"} />
            <NumberInput name="fps" defaultValue={DEFAULT_PARAMS.fps} error={error?.field === "fps"} />
            <NumberInput name="strideMm" defaultValue={DEFAULT_PARAMS.strideMm} error={error?.field === "strideMm"} hint="Body travel per cycle" />
            <NumberInput name="stepHeightMm" defaultValue={DEFAULT_PARAMS.stepHeightMm} error={error?.field === "stepHeightMm"} />
            <NumberInput name="directionDeg" defaultValue={DEFAULT_PARAMS.directionDeg} error={error?.field === "directionDeg"} hint="0 forward, 90 left" />
            <NumberInput name="turnDegPerCycle" defaultValue={DEFAULT_PARAMS.turnDegPerCycle} error={error?.field === "turnDegPerCycle"} />
            <NumberInput
              name="bodyHeightMm"
              placeholder={String(robot.standHeightMm)}
              error={error?.field === "bodyHeightMm"}
              hint="Empty: the robot's stand height"
            />
            <NumberInput
              name="dutyFactor"
              placeholder={chosen?.dutyFactor !== null && chosen?.dutyFactor !== undefined ? chosen.dutyFactor.toFixed(3) : ""}
              error={error?.field === "dutyFactor"}
              hint="Empty: the template's"
            />
          </div>
        </fieldset>
        <div>
          <label htmlFor="new-gait-description" className="block text-sm font-medium">
            Description (optional)
          </label>
          <textarea id="new-gait-description" name="description" rows={2} maxLength={2000} className={inputClass} />
        </div>
        <div className="flex items-center gap-3">
          <button
            type="submit"
            disabled={busy}
            className="rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong disabled:opacity-60"
          >
            {busy ? "Creating…" : "Create and open the editor"}
          </button>
          <Link to="/gaits" className="text-ink-muted hover:text-ink">
            Cancel
          </Link>
        </div>
      </Form>
    </>
  );
}
