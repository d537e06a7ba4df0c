// A mail's state as its sender sees it: by mark and word as well as colour.
import type { MailState as State } from "../../../db/schema";
import { MAIL_STATE_WORDS } from "~/platform/mail-labels";

const MARKS: Record<State, string> = { queued: "◷", sent: "✓", failed: "✕" };
const TONES: Record<State, string> = { queued: "text-ink-muted", sent: "text-ok", failed: "text-danger" };

/** `error`: the mail server's last answer, shown once the mail has failed. */
export function MailState({ state, error }: { state: State; error?: string | null }) {
  return (
    <span className={`inline-flex flex-wrap items-baseline gap-1 ${TONES[state]}`}>
      <span aria-hidden="true">{MARKS[state]}</span>
      <span>{MAIL_STATE_WORDS[state]}</span>
      {state === "failed" && error ? <span className="basis-full text-xs text-ink-muted">{error}</span> : null}
    </span>
  );
}
