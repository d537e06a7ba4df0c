// The review steps the signed-in person may take on a version now: request a
// review (committed, sent back), approve or send back (in review), release
// (approved). The server checks every rule again; this only hides what cannot be done.
import { useId } from "react";
import { Form } from "react-router";
import type { Role, VersionState } from "../../../db/schema";
import { ROLE_LABELS } from "~/platform/permissions";
import { stateWord } from "~/features/versions/state-labels";

export type ReviewActionsProps = {
  version: { id: string; number: number; state: VersionState; errors: number; reviewer: { name: string } | null };
  reviewers: readonly { id: string; name: string; role: Role }[];
  others: readonly { id: string; number: number; message: string }[];
  defaultCompareWith: string | null;
  approval: { allowed: boolean; refusal?: string; needsReason: readonly ("own-version" | "error-flags")[] };
  can: { requestReview: boolean; decide: boolean; release: boolean };
  busy: string | null;
  error: { error: string; field?: string } | null;
  succeeded: string | null;
};

const panel = "space-y-3 rounded-lg border border-line bg-surface p-4 text-sm";
const input = "w-full rounded-md border border-line bg-canvas px-2 py-1.5";
const primary = "rounded-md bg-accent px-4 py-1.5 font-medium text-on-accent hover:bg-accent-strong disabled:opacity-60";
const secondary = "rounded-md border border-line bg-surface px-4 py-1.5 font-medium hover:bg-sunken disabled:opacity-60";

function FieldError({ error, field }: { error: ReviewActionsProps["error"]; field: string }) {
  if (!error || error.field !== field) return null;
  return (
    <p className="text-danger" id={`${field}-error`}>
      <span aria-hidden="true">✕ </span>
      {error.error}
    </p>
  );
}

export function ReviewActions({ version, reviewers, others, defaultCompareWith, approval, can, busy, error, succeeded }: ReviewActionsProps) {
  const id = useId();
  const formError = error ? (
    <p role="alert" className="flex gap-2 rounded-md bg-danger-soft px-3 py-2 text-danger">
      <span aria-hidden="true">✕</span>
      {error.error}
    </p>
  ) : null;
  const canRequest = can.requestReview && (version.state === "committed" || version.state === "sent-back");
  const canDecide = can.decide && version.state === "in-review";
  const canRelease = can.release && version.state === "approved";
  const heading = (
    <h2 className="text-base font-semibold">
      Review <span className="font-normal text-ink-muted">· {stateWord(version.state)}</span>
    </h2>
  );

  if (canRequest) {
    return (
      <Form method="post" className={panel} key={`request-${version.state}-${succeeded}`}>
        {heading}
        {formError}
        <input type="hidden" name="intent" value="request-review" />
        {version.state === "sent-back" ? (
          <p className="text-ink-muted">This version was sent back. Ask again once the comments are answered, or commit a new version.</p>
        ) : null}
        {reviewers.length === 0 ? (
          <p className="text-warning">No lead or owner other than the author can review this version; an owner can invite a lead.</p>
        ) : (
          <>
            <div className="space-y-1">
              <label htmlFor={`${id}-reviewer`} className="block font-medium">
                Reviewer
              </label>
              <select id={`${id}-reviewer`} name="reviewerId" required className={input} defaultValue="">
                <option value="" disabled>
                  Choose a lead or owner
                </option>
                {reviewers.map((reviewer) => (
                  <option key={reviewer.id} value={reviewer.id}>
                    {reviewer.name} ({ROLE_LABELS[reviewer.role].toLowerCase()})
                  </option>
                ))}
              </select>
            </div>
            <FieldError error={error} field="reviewerId" />
            <div className="space-y-1">
              <label htmlFor={`${id}-compare`} className="block font-medium">
                Compare with
              </label>
              <select
                id={`${id}-compare`}
                name="compareWithId"
                className={input}
                defaultValue={defaultCompareWith ?? ""}
                aria-describedby={`${id}-compare-hint`}
              >
                <option value="">No comparison link</option>
                {others.map((other) => (
                  <option key={other.id} value={other.id}>
                    v{other.number} — {other.message}
                  </option>
                ))}
              </select>
              <span id={`${id}-compare-hint`} className="block text-xs text-ink-muted">
                The reviewer's e-mail links to this comparison.
              </span>
            </div>
            <div className="space-y-1">
              <label htmlFor={`${id}-note`} className="block font-medium">
                Note to the reviewer
              </label>
              <textarea id={`${id}-note`} name="comment" rows={3} maxLength={2000} className={input} />
            </div>
            <button type="submit" className={primary} disabled={busy === "request-review"}>
              {busy === "request-review" ? "Requesting…" : "Request review"}
            </button>
          </>
        )}
      </Form>
    );
  }

  if (canDecide) {
    const ownVersion = approval.needsReason.includes("own-version");
    const errorFlags = approval.needsReason.includes("error-flags");
    return (
      <div className={panel}>
        {heading}
        {formError}
        <p className="text-ink-muted">{version.reviewer ? `Assigned to ${version.reviewer.name}.` : "Waiting for a decision."}</p>
        {approval.allowed ? (
          <Form method="post" className="space-y-2" key={`approve-${succeeded}`}>
            <input type="hidden" name="intent" value="approve" />
            <div className="space-y-1">
              <label htmlFor={`${id}-approval`} className="block font-medium">
                Approval comment
              </label>
              <textarea id={`${id}-approval`} name="comment" rows={2} maxLength={2000} className={input} />
            </div>
            {approval.needsReason.length > 0 ? (
              <div className="space-y-1">
                <label htmlFor={`${id}-reason`} className="block font-medium">
                  Override reason
                </label>
                <span id={`${id}-reason-hint`} className="block text-xs text-warning">
                  <span aria-hidden="true">⚑ </span>
                  {ownVersion ? "This is your own version; as an owner you may approve it with a reason. " : ""}
                  {errorFlags ? `It has ${version.errors} error flag${version.errors === 1 ? "" : "s"}; approving it needs a reason. ` : ""}
                  The reason is kept in the review history and the audit log.
                </span>
                <textarea
                  id={`${id}-reason`}
                  name="overrideReason"
                  rows={2}
                  required
                  maxLength={1000}
                  className={input}
                  aria-describedby={`${id}-reason-hint${error?.field === "overrideReason" ? " overrideReason-error" : ""}`}
                />
              </div>
            ) : null}
            <FieldError error={error} field="overrideReason" />
            <button type="submit" className={primary} disabled={busy === "approve"}>
              {busy === "approve" ? "Approving…" : "Approve"}
            </button>
          </Form>
        ) : (
          <p className="rounded bg-sunken px-3 py-2">{approval.refusal}</p>
        )}
        <Form method="post" className="space-y-2 border-t border-line pt-3" key={`send-back-${succeeded}`}>
          <input type="hidden" name="intent" value="send-back" />
          <div className="space-y-1">
            <label htmlFor={`${id}-send-back`} className="block font-medium">
              What needs to change
            </label>
            <textarea
              id={`${id}-send-back`}
              name="comment"
              rows={3}
              maxLength={2000}
              className={input}
              aria-describedby={error?.field === "comment" ? "comment-error" : undefined}
            />
          </div>
          <FieldError error={error} field="comment" />
          <button type="submit" className={secondary} disabled={busy === "send-back"}>
            {busy === "send-back" ? "Sending back…" : "Send back"}
          </button>
        </Form>
      </div>
    );
  }

  if (canRelease) {
    return (
      <Form method="post" className={panel} key={`release-${succeeded}`}>
        {heading}
        {formError}
        <input type="hidden" name="intent" value="release" />
        <p className="text-ink-muted">Releasing makes this the version firmware gets by default; the version released before it becomes retired.</p>
        <div className="space-y-1">
          <label htmlFor={`${id}-release`} className="block font-medium">
            Release note
          </label>
          <textarea id={`${id}-release`} name="comment" rows={2} maxLength={2000} className={input} />
        </div>
        <button type="submit" className={primary} disabled={busy === "release"}>
          {busy === "release" ? "Releasing…" : "Release"}
        </button>
      </Form>
    );
  }

  const status: Record<VersionState, string> = {
    committed: "Not yet in review.",
    "in-review": version.reviewer ? `In review with ${version.reviewer.name}.` : "In review.",
    "sent-back": "Sent back to its author.",
    approved: "Approved; a lead or an owner can release it.",
    released: "Released: this is the version firmware gets by default.",
    retired: "Retired: another version of this gait was released after it.",
  };
  return (
    <div className={panel}>
      {heading}
      {formError}
      <p>{status[version.state]}</p>
    </div>
  );
}
