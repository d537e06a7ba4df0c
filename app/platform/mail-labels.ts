// What pages call a mail's state and topic, one wording for every page (the
// outbox in app/platform/outbox.server.ts holds the mail).
import type { MailState } from "../../db/schema";

/** What a mail is about, so the page that sent it can show how it went. */
export type MailTopic = "invitation" | "review-request" | "review-decision" | "release";

export const MAIL_STATE_WORDS: Record<MailState, string> = {
  queued: "queued",
  sent: "sent",
  failed: "failed — will not be retried; resend",
};

export const MAIL_TOPIC_LABELS: Record<MailTopic, string> = {
  invitation: "Invitation",
  "review-request": "Review request",
  "review-decision": "Review decision",
  release: "Release notice",
};
