// /export/calibration/:robotId: the robot's calibration profiles — list,
// create, edit and delete (robots.calibrate; everyone else reads). Each save
// names the revision it started from, so two people never overwrite each other.
import { Form, Link, data, redirect, useNavigation } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/calibration";
import { ErrorPanel } from "~/components/common/ErrorPanel";
import { Notice } from "~/components/common/Notice";
import { PageHeader } from "~/components/common/PageHeader";
import { ProfileEditor, type ProfileIssues } from "~/components/export/ProfileEditor";
import { requireAccess } from "~/platform/access.server";
import { readForm, refuseNulIn } from "~/platform/body.server";
import { permissionOfEveryIntent } from "~/platform/intent-form.server";
import { calibrationRobot, createProfile, deleteProfile, listProfiles, profileFromForm, updateProfile } from "~/features/robots/calibration.server";
import { ServiceError, formAction, pageGuard, type FormError } from "~/platform/errors.server";
import { can, type RoutePermissions } from "~/platform/permissions";
import { id, revisionNumber } from "~/platform/params";

const params = z.object({ robotId: id() });

async function robotOr404(workspaceId: string, raw: unknown) {
  const parsed = params.safeParse(raw);
  if (!parsed.success) throw data({ message: "There is no robot at this address." }, { status: 404 });
  return pageGuard(() => calibrationRobot(workspaceId, parsed.data.robotId));
}

export const permissions = {
  loader: "robots.read",
  action: { create: "robots.calibrate", import: "robots.calibrate", update: "robots.calibrate", delete: "robots.calibrate" },
} satisfies RoutePermissions;

export async function loader({ request, params: raw }: Route.LoaderArgs) {
  const member = await requireAccess(request, permissions.loader);
  const target = await robotOr404(member.workspace.id, raw);
  const profiles = await listProfiles(target.id);
  const search = new URL(request.url).searchParams;
  const edit = search.get("edit");
  return {
    robot: {
      id: target.id,
      name: target.name,
      revision: target.revision,
      legs: target.robot.legs.map((leg) => ({
        id: leg.id,
        joints: (["coxa", "femur", "tibia"] as const).map((joint) => ({
          joint,
          channel: leg.joints[joint].servo.channel,
          reversed: leg.joints[joint].servo.reversed,
        })),
      })),
    },
    profiles: profiles.map((entry) => ({ ...entry, updatedAt: entry.updatedAt.toISOString() })),
    editing: edit === "new" ? "new" : (profiles.find((entry) => entry.id === edit)?.id ?? null),
    saved: search.get("saved"),
    deleted: search.get("deleted"),
    canEdit: can(member.role, "robots.calibrate"),
  };
}

// A profile's fields for every joint of eight legs, or its JSON pasted, with room to spare.
const PROFILE_FORM_LIMIT_BYTES = 64 * 1024;

const revision = revisionNumber("baseRevision must be the profile revision the edits started from");
export const actionForm = z.discriminatedUnion("intent", [
  z.object({ intent: z.literal("create") }),
  z.object({ intent: z.literal("import"), json: z.string().min(1, "paste the profile's JSON") }),
  z.object({ intent: z.literal("update"), profileId: id(), baseRevision: revision }),
  z.object({ intent: z.literal("delete"), profileId: id(), baseRevision: revision }),
]);

type ActionResult = FormError<{ issues?: ProfileIssues }>;

export async function action({ request, params: raw }: Route.ActionArgs) {
  const member = await requireAccess(request, permissionOfEveryIntent(permissions.action));
  const target = await robotOr404(member.workspace.id, raw);
  const form = await pageGuard(() => readForm(request, PROFILE_FORM_LIMIT_BYTES));
  const parsed = actionForm.safeParse(Object.fromEntries([...form].filter(([key]) => ["intent", "json", "profileId", "baseRevision"].includes(key))));
  const actor = { userId: member.user.id, workspaceId: member.workspace.id };
  const page = `/export/calibration/${target.id}`;
  return formAction(async () => {
    if (!parsed.success) throw new ServiceError(400, "bad-request", parsed.error.issues[0]?.message ?? "The form was incomplete.");
    const command = parsed.data;
    if (command.intent === "delete") {
      const { name } = await deleteProfile(actor, target.id, command.profileId, command.baseRevision);
      return redirect(`${page}?deleted=${encodeURIComponent(name)}`);
    }
    let json: unknown;
    if (command.intent === "import") {
      try {
        json = JSON.parse(command.json);
      } catch (error) {
        throw new ServiceError(400, "bad-request", `The pasted text is not JSON: ${error instanceof Error ? error.message : String(error)}`, { field: "json" });
      }
      refuseNulIn(json, "The pasted text", "json");
    } else {
      const fromForm = profileFromForm(target.robot, form);
      if (fromForm.issues.length) throw new ServiceError(422, "invalid", "Some fields are not valid.", { issues: fromForm.issues });
      json = fromForm.json;
    }
    const saved =
      command.intent === "update"
        ? await updateProfile(actor, target.id, command.profileId, json, command.baseRevision)
        : await createProfile(actor, target.id, json);
    return redirect(`${page}?edit=${saved.id}&saved=${saved.revision}`);
  });
}

export const meta: Route.MetaFunction = ({ data: loaded }) => [{ title: `Calibration of ${loaded?.robot.name ?? "a robot"} · Gaitloom` }];

const when = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;

export default function Calibration({ loaderData, actionData }: Route.ComponentProps) {
  const { robot, profiles, editing, saved, deleted, canEdit } = loaderData;
  const result = actionData as ActionResult | undefined;
  const navigation = useNavigation();
  const current = profiles.find((entry) => entry.id === editing) ?? null;
  return (
    <>
      <PageHeader
        title={`Calibration of ${robot.name}`}
        lead={`Per-unit servo trims, reversals and channels, checked against revision ${robot.revision} of the robot and applied when a table is exported.`}
      >
        <Link to="/export/calibration" className="rounded-md border border-line px-3 py-2 text-sm hover:bg-sunken">
          All robots
        </Link>
        {canEdit ? (
          <Link to="?edit=new" className="rounded-md bg-accent px-3 py-2 text-sm font-medium text-on-accent hover:bg-accent-strong">
            New profile
          </Link>
        ) : null}
      </PageHeader>
      <Notice error={result?.error} success={saved && current ? `Saved “${current.name}”, revision ${saved}.` : deleted ? `Deleted “${deleted}”.` : null} />
      {result?.error && /changed since you opened it|no longer exists/.test(result.error) ? (
        <p className="-mt-2 mb-4 text-sm">
          <Link to={`?edit=${editing ?? ""}`} reloadDocument className="text-accent underline underline-offset-2">
            Reload the profile
          </Link>{" "}
          to see the other edits; what you typed is still in the form below.
        </p>
      ) : null}
      <div className="grid gap-6 xl:grid-cols-[20rem_minmax(0,1fr)]">
        <section aria-labelledby="profiles-heading">
          <h2 id="profiles-heading" className="mb-2 font-semibold">
            Profiles
          </h2>
          {profiles.length === 0 ? (
            <p className="rounded-lg border border-dashed border-line bg-surface p-4 text-sm text-ink-muted">
              None yet. {canEdit ? "Make one per physical unit, named by its serial number." : "Firmware, animators, leads and owners can add them."}
            </p>
          ) : (
            <ul className="divide-y divide-line rounded-lg border border-line bg-surface">
              {profiles.map((entry) => (
                <li key={entry.id} className={`px-4 py-2 ${entry.id === editing ? "bg-accent-soft" : ""}`}>
                  <Link to={`?edit=${entry.id}`} className="font-medium text-accent underline underline-offset-2">
                    {entry.name}
                  </Link>
                  <span className="block text-xs text-ink-muted">
                    revision {entry.revision} · {when(entry.updatedAt)}
                    {entry.updatedBy ? ` · ${entry.updatedBy.name}` : ""}
                  </span>
                </li>
              ))}
            </ul>
          )}
          {canEdit ? (
            <details className="mt-4 rounded-lg border border-line bg-surface p-4 text-sm">
              <summary className="cursor-pointer font-medium">Paste a profile as JSON</summary>
              <Form method="post" className="mt-2 space-y-2">
                <input type="hidden" name="intent" value="import" />
                <textarea
                  name="json"
                  rows={8}
                  aria-label="Profile JSON"
                  className="w-full rounded-md border border-line bg-surface p-2 font-mono text-xs"
                  placeholder={'{ "name": "SN-0042", "joints": { "LF": { "femur": { "trimDeg": 1.5 } } } }'}
                />
                <p className="text-xs text-ink-muted">
                  The shape is in{" "}
                  <a href="/api/v1/schema/calibration.json" className="underline">
                    /api/v1/schema/calibration.json
                  </a>
                  .
                </p>
                <button type="submit" className="rounded-md border border-line px-3 py-1 hover:bg-sunken">
                  Add the profile
                </button>
              </Form>
            </details>
          ) : null}
        </section>
        <section aria-labelledby="editor-heading">
          {editing ? (
            <ProfileEditor
              key={`${editing}-${current?.revision ?? 0}`}
              robot={robot}
              profile={current}
              readOnly={!canEdit}
              issues={result?.details?.issues ?? []}
              busy={navigation.state === "submitting"}
            />
          ) : (
            <p id="editor-heading" className="rounded-lg border border-dashed border-line bg-surface p-6 text-ink-muted">
              Choose a profile to {canEdit ? "edit" : "see"} it{canEdit ? ", or start a new one" : ""}.
            </p>
          )}
        </section>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPanel error={error} />;
}
