// The local SMTP fake (scripts/fakes/smtp.ts) keeps running when a client
// drops its connection in the middle of a message: a runner killed mid-send,
// a network reset. It once crashed on that and took local mail down until it
// was restarted by hand.
import { connect, type Socket } from "node:net";
import nodemailer from "nodemailer";
import { afterAll, beforeAll, beforeEach, describe, expect, test } from "vitest";
import { MailFake, sleep, waitForMail } from "../support/mail";

let fake: MailFake;

beforeAll(async () => {
  fake = await MailFake.start();
}, 60_000);

// Each test meets a running fake, whatever the one before did to it.
beforeEach(async () => {
  await fake.start();
}, 60_000);

afterAll(async () => {
  await fake?.stop();
});

/** Talks SMTP up to the middle of a message's DATA, then hands back the socket. */
async function halfAMessage(port: number): Promise<Socket> {
  const socket = connect(port, "127.0.0.1");
  const steps = ["EHLO dropper.test", "MAIL FROM:<dropper@example.test>", "RCPT TO:<nobody@example.test>", "DATA"];
  await new Promise<void>((resolve, reject) => {
    let replies = "";
    let sent = 0;
    socket.on("error", reject);
    socket.on("data", (chunk) => {
      replies += chunk;
      // Each command waits for the reply to the one before: a 220 greeting, 250s, then 354 for DATA.
      if (/^354 /m.test(replies)) {
        // Resolved once the half is written and the fake has had time to read it.
        socket.write("Subject: cut short\r\nTo: nobody@example.test\r\n\r\nThe first half of a message that never ends", () => setTimeout(resolve, 200));
        return;
      }
      const finalLines = replies.split("\r\n").filter((line) => /^\d{3} .*/.test(line)).length;
      if (finalLines > sent && sent < steps.length) socket.write(`${steps[sent++]}\r\n`);
    });
  });
  return socket;
}

async function deliver(to: string, subject: string) {
  const transport = nodemailer.createTransport({ url: fake.smtpUrl });
  await transport.sendMail({ from: "test@example.test", to, subject, text: `${subject}: a whole message.` });
  transport.close();
}

describe("the SMTP fake", () => {
  test("survives a client that resets its connection in the middle of DATA; the next message still arrives", async () => {
    const socket = await halfAMessage(fake.smtpPort);
    socket.resetAndDestroy();
    await sleep(500);
    expect(await fake.alive(), `the fake ended:\n${fake.output()}`).toBe(true);
    await deliver("after-reset@example.test", "After a reset");
    const mails = await waitForMail(fake.inboxUrl, "after-reset@example.test", { timeoutMs: 5_000 });
    expect(mails.map((mail) => mail.subject)).toEqual(["After a reset"]);
  });

  test("survives a client that closes its connection in the middle of DATA, keeping nothing of the half message", async () => {
    const socket = await halfAMessage(fake.smtpPort);
    socket.destroy();
    await sleep(500);
    expect(await fake.alive(), `the fake ended:\n${fake.output()}`).toBe(true);
    await deliver("after-close@example.test", "After a close");
    expect((await waitForMail(fake.inboxUrl, "after-close@example.test", { timeoutMs: 5_000 })).map((mail) => mail.subject)).toEqual(["After a close"]);
    expect(await fake.messages("nobody@example.test")).toEqual([]);
  });
});
