// Outgoing e-mail over SMTP (locally: the fake SMTP server started by the scripts).
import nodemailer, { type Transporter } from "nodemailer";
import { config } from "./config.server";

let transport: Transporter | undefined;

export type Mail = { to: string; subject: string; text: string };

export async function sendMail(mail: Mail): Promise<void> {
  const settings = config().mail;
  transport ??= nodemailer.createTransport(settings.smtpUrl);
  await transport.sendMail({ from: settings.from, ...mail });
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
