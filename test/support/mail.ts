// The mail path as integration tests run it, each test file with its own:
// the local SMTP fake (scripts/fakes/smtp.ts) on free ports, and the job
// runner process (app/jobs/job-runner.ts) delivering the outbox of the file's
// database, both real processes that a test may stop and start again. The
// inbox is read by polling, since mail now leaves after the action's answer.
import { spawn, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";
import path from "node:path";
import { afterAll, beforeAll } from "vitest";

const ROOT = process.cwd();

export type InboxMail = { id: string; subject: string; text: string; to: string[]; from: string };

/** A port nothing listens on now, for a child process to take. */
async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

type Child = { process: ChildProcess; output: () => string; exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }> };

/**
 * One Node process with tsx's loader, not the tsx command: that one relays a
 * signal to its child and, when the child is slow to confirm it (30 ms, often
 * missed on a loaded machine), kills it with SIGKILL, so a graceful stop
 * could not be told from a crash.
 */
function spawnTsx(entry: string, args: string[], env: Record<string, string>): Child {
  const child = spawn(process.execPath, ["--import", "tsx", path.join(ROOT, entry), ...args], {
    cwd: ROOT,
    env: { ...process.env, ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let output = "";
  child.stdout!.on("data", (chunk) => (output += chunk));
  child.stderr!.on("data", (chunk) => (output += chunk));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    child.once("exit", (code, signal) => resolve({ code, signal })),
  );
  return { process: child, output: () => output, exited };
}

/** Resolves when `ready` answers true; fails with the child's output when it exits first or the time runs out. */
async function waitUntilReady(child: Child, what: string, ready: () => Promise<boolean> | boolean, timeoutMs = 30_000): Promise<void> {
  let gone = false;
  void child.exited.then(() => (gone = true));
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (gone) throw new Error(`${what} exited before it was ready:\n${child.output()}`);
    if (await ready()) return;
    await sleep(100);
  }
  child.process.kill("SIGKILL");
  throw new Error(`${what} was not ready within ${timeoutMs} ms:\n${child.output()}`);
}

export const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function stopChild(child: Child, signal: NodeJS.Signals = "SIGTERM") {
  if (child.process.exitCode !== null || child.process.signalCode !== null) return child.exited;
  const started = Date.now();
  child.process.kill(signal);
  const ended = await child.exited;
  return { ...ended, ms: Date.now() - started };
}

/** The SMTP fake as a process of its own, stopped and started again on the same ports. */
export class MailFake {
  private child: Child | null = null;
  private constructor(
    readonly smtpPort: number,
    readonly apiPort: number,
  ) {}

  static async start(): Promise<MailFake> {
    const fake = new MailFake(await freePort(), await freePort());
    await fake.start();
    return fake;
  }

  get smtpUrl() {
    return `smtp://127.0.0.1:${this.smtpPort}`;
  }

  get inboxUrl() {
    return `http://127.0.0.1:${this.apiPort}`;
  }

  get running() {
    return this.child !== null && this.child.process.exitCode === null && this.child.process.signalCode === null;
  }

  output() {
    return this.child?.output() ?? "";
  }

  /** Whether the process still runs and its inbox answers. */
  async alive(): Promise<boolean> {
    if (!this.running) return false;
    return fetch(`${this.inboxUrl}/messages`).then(
      (response) => response.ok,
      () => false,
    );
  }

  async start(): Promise<void> {
    if (this.running) return;
    const child = spawnTsx("scripts/fakes/smtp.ts", ["--smtp-port", String(this.smtpPort), "--api-port", String(this.apiPort)], {});
    this.child = child;
    await waitUntilReady(child, "the SMTP fake", async () => {
      if (!/fake SMTP on/.test(child.output())) return false;
      return fetch(`${this.inboxUrl}/messages`).then(
        (response) => response.ok,
        () => false,
      );
    });
  }

  /** Ends the process (its messages go with it, as when the real one stops). */
  async stop(): Promise<void> {
    if (this.child) await stopChild(this.child);
  }

  async messages(to?: string): Promise<InboxMail[]> {
    const response = await fetch(`${this.inboxUrl}/messages${to ? `?to=${encodeURIComponent(to)}` : ""}`);
    if (!response.ok) throw new Error(`the SMTP fake's inbox answered ${response.status}`);
    return (await response.json()) as InboxMail[];
  }
}

/**
 * Mails to `to` (whose text holds `needle`, when given), waiting up to
 * `timeoutMs` for at least `count` of them; returns what is there then, newest
 * first, so a test can also see that no more than `count` came.
 */
export async function waitForMail(inboxUrl: string, to: string, options: { needle?: string; count?: number; timeoutMs?: number } = {}): Promise<InboxMail[]> {
  const { needle, count = 1, timeoutMs = 15_000 } = options;
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const response = await fetch(`${inboxUrl}/messages?to=${encodeURIComponent(to)}`).catch(() => null);
    const all = response?.ok ? ((await response.json()) as InboxMail[]) : [];
    const found = needle ? all.filter((mail) => mail.text.includes(needle) || mail.subject.includes(needle)) : all;
    if (found.length >= count || Date.now() > deadline) return found;
    await sleep(100);
  }
}

/** Settings of a runner for one test: the mail retries (pg-boss retryLimit, retryDelay in s with backoff) and the job poll, in s. */
export type RunnerSettings = { retryLimit?: number; retryDelaySeconds?: number; pollSeconds?: number; sweepSeconds?: number };

/** The job runner as `npm start` runs it, on this test file's database, sending to `smtpUrl`. */
export class JobRunner {
  private constructor(private readonly child: Child) {}

  static async start(smtpUrl: string, settings: RunnerSettings = {}): Promise<JobRunner> {
    const databaseUrl = process.env.DATABASE_URL;
    if (!databaseUrl) throw new Error("DATABASE_URL is not set: the runner needs the test file's database");
    const child = spawnTsx("app/jobs/job-runner.ts", [], {
      GAITLOOM_ENV: "test",
      DATABASE_URL: databaseUrl,
      SMTP_URL: smtpUrl,
      GAITLOOM_MAIL_RETRY_LIMIT: String(settings.retryLimit ?? 5),
      GAITLOOM_MAIL_RETRY_DELAY_S: String(settings.retryDelaySeconds ?? 1),
      GAITLOOM_JOB_POLL_S: String(settings.pollSeconds ?? 0.5),
      GAITLOOM_JOB_SWEEP_S: String(settings.sweepSeconds ?? 5),
    });
    await waitUntilReady(child, "the job runner", () => /\[jobs\] ready/.test(child.output()));
    return new JobRunner(child);
  }

  output() {
    return this.child.output();
  }

  /** Sends SIGTERM (or `signal`) and waits for the exit. */
  stop(signal: NodeJS.Signals = "SIGTERM") {
    return stopChild(this.child, signal);
  }
}

/**
 * For a test file that reads the mail its actions send: an SMTP fake and a job
 * runner of its own for the whole file, the app's mail settings pointed at them.
 */
export function mailStackForFile(settings: RunnerSettings = {}): { fake: () => MailFake; runner: () => JobRunner } {
  let fake: MailFake | undefined;
  let runner: JobRunner | undefined;
  beforeAll(async () => {
    fake = await MailFake.start();
    process.env.SMTP_URL = fake.smtpUrl;
    process.env.MAIL_INBOX_URL = fake.inboxUrl;
    runner = await JobRunner.start(fake.smtpUrl, settings);
  }, 60_000);
  afterAll(async () => {
    await runner?.stop();
    await fake?.stop();
  }, 30_000);
  return {
    fake: () => {
      if (!fake) throw new Error("the SMTP fake starts in beforeAll");
      return fake;
    },
    runner: () => {
      if (!runner) throw new Error("the job runner starts in beforeAll");
      return runner;
    },
  };
}
