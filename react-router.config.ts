import type { Config } from "@react-router/dev/config";
import path from "node:path";
import { build } from "vite";

export default {
  ssr: true,
  appDirectory: "app",
  buildDirectory: "build",
  // Root middleware guards every mutation's origin in one place.
  future: { v8_middleware: true },
  // Two entries beside the server bundle, which the server build (one entry
  // only) does not make: the worker pool's (app/platform/worker-pool.server.ts),
  // as build/server/core-worker.js, since worker threads load a file of their
  // own; and the job runner's process (app/jobs/job-runner.ts), as
  // build/server/job-runner.js.
  async buildEnd({ reactRouterConfig }) {
    const entries = { "core-worker.js": "app/workers/core-worker.ts", "job-runner.js": "app/jobs/job-runner.ts" };
    for (const [output, entry] of Object.entries(entries)) {
      await build({
        configFile: false,
        logLevel: "warn",
        // public/ is the client build's.
        publicDir: false,
        build: {
          ssr: entry,
          outDir: path.join(reactRouterConfig.buildDirectory, "server"),
          emptyOutDir: false,
          rolldownOptions: { output: { entryFileNames: output } },
        },
      });
    }
  },
} satisfies Config;
