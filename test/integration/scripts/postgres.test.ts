// The start scripts' cluster helpers (scripts/lib/*.sh), run as `npm start`
// runs them, on a throw-away cluster of their own in a temporary folder.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, test } from "vitest";

const scripts = join(process.cwd(), "scripts/lib");

function bash(script: string, env: Record<string, string>) {
  const run = spawnSync("bash", ["-c", `set -u; source "${scripts}/common.sh"; source "${scripts}/postgres.sh"; ${script}`], {
    env: { ...process.env, ...env },
    encoding: "utf8",
    timeout: 90_000,
  });
  return { status: run.status, out: `${run.stdout}${run.stderr}` };
}

describe("the project-local cluster honours GAITLOOM_PG_PORT", () => {
  const dataDir = mkdtempSync(join(tmpdir(), "gaitloom-pg-"));
  execFileSync("chmod", ["755", dataDir]);
  const env = { GAITLOOM_DATA_DIR: dataDir };
  afterAll(() => {
    bash("pg_choose_base; pg_stop", { ...env, GAITLOOM_PG_PORT: "54391" });
    bash("pg_choose_base; pg_stop", { ...env, GAITLOOM_PG_PORT: "54392" });
    rmSync(dataDir, { recursive: true, force: true });
  });

  test("a cluster created on one port starts on another when the variable says so, and says which", { timeout: 60_000 }, () => {
    const first = bash("pg_start && pg_super -c 'show port' && pg_stop", { ...env, GAITLOOM_PG_PORT: "54391" });
    expect(first.status, first.out).toBe(0);
    expect(first.out).toContain("54391");
    const second = bash("pg_start && pg_super -c 'show port' && pg_stop", { ...env, GAITLOOM_PG_PORT: "54392" });
    expect(second.status, second.out).toBe(0);
    expect(second.out).toMatch(/^54392$/m);
    expect(second.out).toContain(dataDir);
  });
});

describe("pid_alive", () => {
  test("says nothing on stderr when the process ends while it looks", { timeout: 60_000 }, () => {
    // Many short-lived processes: some end between the check and the read.
    const run = bash("for i in $(seq 1 150); do (exit 0) & p=$!; pid_alive $p || true; done; wait", {});
    expect(run.status).toBe(0);
    expect(run.out).not.toMatch(/can't read|No such file/);
  });
});
