// The job runner's process: `tsx app/jobs/job-runner.ts` in the source tree,
// `node build/server/job-runner.js` from a build (react-router.config.ts makes
// it). npm start and npm test start and stop it (scripts/lib/services.sh).
// SIGTERM or SIGINT lets the jobs in hand finish, then ends the process.
import { startJobRunner } from "./runner.server";

const runner = await startJobRunner();
console.log(`[jobs] ready: ${runner.queues.join(", ")}`);

for (const signal of ["SIGTERM", "SIGINT"] as const) {
  process.once(signal, () => {
    runner.stop().then(
      () => process.exit(0),
      (error) => {
        console.error("[jobs] stopping failed:", error);
        process.exit(1);
      },
    );
  });
}
