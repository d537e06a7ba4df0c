// The form of one calibration profile: its name, and per joint a trim, a
// reversal and a channel that override the robot definition for this unit.
// Fields are named by the profile's paths (joints.LF.femur.trimDeg), so each
// issue the server finds is shown beside its field.
import { Form } from "react-router";
import { decimalInput } from "~/components/common/decimal-input";
import { IssueList } from "~/components/common/IssueList";

export type ProfileIssues = { path: string; message: string }[];

type JointOverride = { trimDeg?: number; reversed?: boolean; channel?: number };

export type EditorRobot = {
  id: string;
  name: string;
  legs: { id: string; joints: { joint: "coxa" | "femur" | "tibia"; channel: number; reversed: boolean }[] }[];
};

export type EditorProfile = {
  id: string;
  name: string;
  revision: number;
  profile: { name: string; description?: string; joints: Record<string, Partial<Record<"coxa" | "femur" | "tibia", JointOverride>>> };
};

const input = "rounded border bg-surface px-2 py-1 text-sm";

function Issues({ id, messages }: { id: string; messages: string[] }) {
  if (messages.length === 0) return null;
  return (
    <span id={id} className="mt-0.5 block text-left text-xs text-danger">
      {messages.map((message) => (
        <span key={message} className="block">
          <span aria-hidden="true">⚠ </span>
          {message}
        </span>
      ))}
    </span>
  );
}

export function ProfileEditor({
  robot,
  profile,
  readOnly,
  issues,
  busy,
}: {
  robot: EditorRobot;
  profile: EditorProfile | null;
  readOnly: boolean;
  issues: ProfileIssues;
  busy: boolean;
}) {
  const at = (path: string) => issues.filter((issue) => issue.path === path).map((issue) => issue.message);
  const known = new Set<string>(["name", "description"]);
  for (const leg of robot.legs)
    for (const { joint } of leg.joints) for (const key of ["trimDeg", "reversed", "channel"]) known.add(`joints.${leg.id}.${joint}.${key}`);
  // Issues of no one field (two joints on one channel, a leg the robot lacks) go above the table.
  const general = issues.filter((issue) => !known.has(issue.path));
  const fieldProps = (path: string) => {
    const messages = at(path);
    const id = `field-${path.replaceAll(".", "-")}`;
    const attrs = {
      id,
      name: path,
      disabled: readOnly,
      "aria-invalid": messages.length > 0 || undefined,
      "aria-describedby": messages.length > 0 ? `${id}-issues` : undefined,
    };
    return { id, attrs, messages };
  };
  const name = fieldProps("name");
  const description = fieldProps("description");
  return (
    <div className="rounded-lg border border-line bg-surface p-5">
      <h2 id="editor-heading" className="mb-3 text-lg font-semibold">
        {profile ? `Profile “${profile.name}”, revision ${profile.revision}` : "New profile"}
      </h2>
      <Form method="post" className="space-y-4">
        <input type="hidden" name="intent" value={profile ? "update" : "create"} />
        {profile ? (
          <>
            <input type="hidden" name="profileId" value={profile.id} />
            <input type="hidden" name="baseRevision" value={profile.revision} />
          </>
        ) : null}
        <div className="grid gap-4 md:grid-cols-2">
          <label htmlFor={name.id}>
            <span className="block text-sm font-medium">Name (e.g. the unit's serial number)</span>
            <input
              {...name.attrs}
              required
              maxLength={100}
              defaultValue={profile?.name ?? ""}
              className={`${input} mt-1 w-full ${name.messages.length ? "border-danger bg-danger-soft" : "border-line"}`}
            />
            <Issues id={`${name.id}-issues`} messages={name.messages} />
          </label>
          <label htmlFor={description.id}>
            <span className="block text-sm font-medium">Notes</span>
            <input
              {...description.attrs}
              maxLength={2000}
              defaultValue={profile?.profile.description ?? ""}
              placeholder="e.g. left femur servo replaced in March"
              className={`${input} mt-1 w-full border-line`}
            />
            <Issues id={`${description.id}-issues`} messages={description.messages} />
          </label>
        </div>
        {general.length ? <IssueList issues={general} role="alert" className="rounded-md bg-danger-soft px-4 py-2 text-sm text-danger" /> : null}
        <table className="w-full border-collapse text-sm">
          <caption className="mb-1 text-left text-xs text-ink-muted">
            Empty fields keep the robot definition's value (shown greyed). Trim is added to every frame's servo angle, ±45° at most.
          </caption>
          <thead className="border-b border-line text-left text-ink-muted">
            <tr>
              <th className="px-2 py-1 font-medium">Joint</th>
              <th className="px-2 py-1 text-right font-medium">Trim (°)</th>
              <th className="px-2 py-1 font-medium">Direction</th>
              <th className="px-2 py-1 text-right font-medium">Channel</th>
            </tr>
          </thead>
          <tbody>
            {robot.legs.flatMap((leg) =>
              leg.joints.map(({ joint, channel, reversed }) => {
                const own = profile?.profile.joints[leg.id]?.[joint] ?? {};
                const trim = fieldProps(`joints.${leg.id}.${joint}.trimDeg`);
                const direction = fieldProps(`joints.${leg.id}.${joint}.reversed`);
                const channelField = fieldProps(`joints.${leg.id}.${joint}.channel`);
                return (
                  <tr key={`${leg.id}.${joint}`} className="border-b border-line align-top last:border-0">
                    <th scope="row" className="px-2 py-1 text-left font-mono font-normal">
                      {leg.id}.{joint}
                    </th>
                    <td className="px-2 py-1 text-right">
                      <input
                        {...trim.attrs}
                        aria-label={`${leg.id} ${joint} trim, degrees`}
                        {...decimalInput}
                        defaultValue={own.trimDeg ?? ""}
                        placeholder="0"
                        className={`${input} w-20 text-right font-mono ${trim.messages.length ? "border-danger bg-danger-soft" : "border-line"}`}
                      />
                      <Issues id={`${trim.id}-issues`} messages={trim.messages} />
                    </td>
                    <td className="px-2 py-1">
                      <select
                        {...direction.attrs}
                        aria-label={`${leg.id} ${joint} direction`}
                        defaultValue={own.reversed === undefined ? "" : String(own.reversed)}
                        className={`${input} border-line`}
                      >
                        <option value="">as the robot ({reversed ? "reversed" : "normal"})</option>
                        <option value="false">normal</option>
                        <option value="true">reversed</option>
                      </select>
                      <Issues id={`${direction.id}-issues`} messages={direction.messages} />
                    </td>
                    <td className="px-2 py-1 text-right">
                      <input
                        {...channelField.attrs}
                        aria-label={`${leg.id} ${joint} channel`}
                        inputMode="numeric"
                        autoComplete="off"
                        defaultValue={own.channel ?? ""}
                        placeholder={String(channel)}
                        className={`${input} w-16 text-right font-mono ${channelField.messages.length ? "border-danger bg-danger-soft" : "border-line"}`}
                      />
                      <Issues id={`${channelField.id}-issues`} messages={channelField.messages} />
                    </td>
                  </tr>
                );
              }),
            )}
          </tbody>
        </table>
        {readOnly ? (
          <p className="text-sm text-ink-muted">Your role can read calibration profiles; firmware, animators, leads and owners can change them.</p>
        ) : (
          <button
            type="submit"
            disabled={busy}
            className="rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong disabled:opacity-60"
          >
            {busy ? "Saving…" : profile ? `Save as revision ${profile.revision + 1}` : "Create the profile"}
          </button>
        )}
      </Form>
      {profile && !readOnly ? (
        <Form
          method="post"
          className="mt-4 border-t border-line pt-4"
          onSubmit={(event) => {
            if (!window.confirm(`Delete the calibration profile “${profile.name}”? Tables exported with it keep its name in their header.`))
              event.preventDefault();
          }}
        >
          <input type="hidden" name="intent" value="delete" />
          <input type="hidden" name="profileId" value={profile.id} />
          <input type="hidden" name="baseRevision" value={profile.revision} />
          <button type="submit" className="rounded-md border border-line px-3 py-1 text-sm text-danger hover:bg-sunken">
            Delete this profile
          </button>
        </Form>
      ) : null}
    </div>
  );
}
