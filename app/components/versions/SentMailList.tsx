// The mail the signed-in person's review steps sent about a version, with how
// each went; one that failed can be sent again from here.
import { useId } from "react";
import { Form } from "react-router";
import type { MailState as State } from "../../../db/schema";
import { MailState } from "~/components/common/MailState";
import { MAIL_TOPIC_LABELS, type MailTopic } from "~/platform/mail-labels";

export type SentMailListProps = {
  mails: readonly { id: string; topic: MailTopic; to: string; state: State; lastError: string | null }[];
  busy: boolean;
};

export function SentMailList({ mails, busy }: SentMailListProps) {
  const id = useId();
  if (mails.length === 0) return null;
  return (
    <section aria-labelledby={`${id}-heading`} className="space-y-2 rounded-lg border border-line bg-surface p-4 text-sm">
      <h2 id={`${id}-heading`} className="text-base font-semibold">
        Your e-mails about this version
      </h2>
      <ul aria-label="Your e-mails about this version" className="space-y-2">
        {mails.map((mail) => (
          <li key={mail.id} className="space-y-1">
            <p>
              <span className="font-medium">{MAIL_TOPIC_LABELS[mail.topic]}</span> to {mail.to}: <MailState state={mail.state} error={mail.lastError} />
            </p>
            {mail.state === "failed" ? (
              <Form method="post">
                <input type="hidden" name="intent" value="resend-mail" />
                <input type="hidden" name="mailId" value={mail.id} />
                <button type="submit" disabled={busy} className="rounded-md border border-line px-3 py-1 hover:bg-sunken disabled:opacity-60">
                  Send again
                </button>
              </Form>
            ) : null}
          </li>
        ))}
      </ul>
    </section>
  );
}
