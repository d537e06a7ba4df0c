// Adds up the suites' JSON reports into the one closing line of `npm test`.
// Dependency-free on purpose; a missing report counts as one failure. The
// typecheck, lint and format steps and the probe sample count as one test
// each, by exit code (none: it did not run, one failure).
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";

const [reports, typecheckRc, lintRc, formatRc, probeRc] = process.argv.slice(2);
const suites = [];

for (const [name, rc] of [
  ["typecheck", typecheckRc],
  ["lint", lintRc],
  ["format", formatRc],
  ["probe", probeRc],
]) {
  suites.push({ name, passed: rc === "0" ? 1 : 0, failed: rc === "0" ? 0 : 1, ...(rc === undefined || rc === "" ? { note: "did not run" } : {}) });
}

const read = (file) => (existsSync(join(reports, file)) ? JSON.parse(readFileSync(join(reports, file), "utf8")) : null);

const vitest = read("vitest.json");
suites.push(
  vitest
    ? { name: "vitest", passed: vitest.numPassedTests, failed: vitest.numFailedTests + (vitest.success || vitest.numFailedTests ? 0 : 1) }
    : { name: "vitest", passed: 0, failed: 1, note: "no report" },
);

const e2e = read("e2e.json");
suites.push(
  e2e
    ? { name: "e2e", passed: e2e.stats.expected + e2e.stats.flaky, failed: e2e.stats.unexpected + (e2e.errors?.length ?? 0) }
    : { name: "e2e", passed: 0, failed: 1, note: "did not run" },
);

for (const suite of suites) {
  console.log(`  ${suite.name.padEnd(10)} ${suite.passed} passed, ${suite.failed} failed${suite.note ? ` (${suite.note})` : ""}`);
}
const passed = suites.reduce((n, s) => n + s.passed, 0);
const failed = suites.reduce((n, s) => n + s.failed, 0);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
