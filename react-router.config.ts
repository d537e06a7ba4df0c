import type { Config } from "@react-router/dev/config";
import path from "node:path";
import { build } from "vite";

export default {
  ssr: true,
  appDirectory: "app",
  buildDirectory: "build",
  // Root middleware guards every mutation's origin in one place.
  future: { v8_middleware: true },
  // The worker pool's entry (app/platform/worker-pool.server.ts) beside the
  // server bundle, as build/server/core-worker.js: worker threads load a file
  // of their own, which the server build, one entry only, does not make.
  async buildEnd({ reactRouterConfig }) {
    await build({
      configFile: false,
      logLevel: "warn",
      // public/ is the client build's.
      publicDir: false,
      build: {
        ssr: "app/workers/core-worker.ts",
        outDir: path.join(reactRouterConfig.buildDirectory, "server"),
        emptyOutDir: false,
        rolldownOptions: { output: { entryFileNames: "core-worker.js" } },
      },
    });
  },
} satisfies Config;
