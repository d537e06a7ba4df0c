// The SMTP connection (locally: the fake SMTP server started by the scripts).
// Only the job runner sends (app/platform/outbox.server.ts); actions queue.
import nodemailer, { type Transporter } from "nodemailer";
import { config } from "./config.server";

let transport: Transporter | undefined;

export type Mail = { to: string; subject: string; text: string };

export async function sendMail(mail: Mail): Promise<void> {
  const settings = config().mail;
  // Short timeouts: the runner holds the mail's row locked while it sends, and
  // a server that hangs should count as a failed try, retried later.
  transport ??= nodemailer.createTransport({ url: settings.smtpUrl, connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 });
  await transport.sendMail({ from: settings.from, ...mail });
}

export function closeMailTransport(): void {
  transport?.close();
  transport = undefined;
}

export type InboxMessage = { id: string; receivedAt: string; from: string; to: string[]; subject: string; text: string };

/** The local fake's captured messages; null outside local and test mode. */
export async function localInbox(): Promise<InboxMessage[] | null> {
  const url = config().mail.inboxUrl;
  if (!url) return null;
  const response = await fetch(`${url}/messages`);
  if (!response.ok) throw new Error(`The local mail server answered ${response.status}.`);
  return (await response.json()) as InboxMessage[];
}
