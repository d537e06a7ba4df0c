// A local SMTP server on 127.0.0.1 that keeps every message it receives and
// shows them over a small JSON API (read by the app's local inbox and by tests).
// Usage: tsx scripts/fakes/smtp.ts --smtp-port 2525 --api-port 2526
import { randomUUID } from "node:crypto";
import { createServer } from "node:http";
import { parseArgs } from "node:util";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

export type CapturedMessage = {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
};

const { values } = parseArgs({
  options: { "smtp-port": { type: "string", default: "2525" }, "api-port": { type: "string", default: "2526" } },
});

const messages: CapturedMessage[] = [];
const MAX_MESSAGES = 500;

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  banner: "Gaitloom local mail",
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((parsed) => {
        const to = (session.envelope.rcptTo ?? []).map((address) => address.address);
        messages.unshift({
          id: randomUUID(),
          receivedAt: new Date().toISOString(),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
          to,
          subject: parsed.subject ?? "",
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : null,
        });
        messages.length = Math.min(messages.length, MAX_MESSAGES);
        callback();
      })
      .catch(callback);
  },
});

// A client that drops its connection (a reset mid-DATA: a runner killed while
// sending) is an error of that connection only; unhandled, it ended the process.
smtp.on("error", (error) => console.error(`fake SMTP: a connection failed: ${error.message}`));

const api = createServer((request, response) => {
  const url = new URL(request.url ?? "/", "http://127.0.0.1");
  const json = (status: number, body: unknown) => {
    response.writeHead(status, { "Content-Type": "application/json" });
    response.end(JSON.stringify(body));
  };
  if (url.pathname === "/messages" && request.method === "GET") {
    const to = url.searchParams.get("to");
    return json(200, to ? messages.filter((message) => message.to.includes(to)) : messages);
  }
  if (url.pathname === "/messages" && request.method === "DELETE") {
    messages.length = 0;
    return json(200, { ok: true });
  }
  const match = url.pathname.match(/^\/messages\/([\w-]+)$/);
  if (match && request.method === "GET") {
    const message = messages.find((candidate) => candidate.id === match[1]);
    return message ? json(200, message) : json(404, { error: "no such message" });
  }
  json(404, { error: "not found" });
});

smtp.listen(Number(values["smtp-port"]), "127.0.0.1", () =>
  console.log(`fake SMTP on 127.0.0.1:${values["smtp-port"]}, messages at http://127.0.0.1:${values["api-port"]}/messages`),
);
api.listen(Number(values["api-port"]), "127.0.0.1");
for (const signal of ["SIGTERM", "SIGINT"] as const) {
  process.on(signal, () => {
    api.close();
    smtp.close(() => process.exit(0));
  });
}
