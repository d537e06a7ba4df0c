import { reactRouter } from "@react-router/dev/vite";
import tailwindcss from "@tailwindcss/vite";
import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const alias = { "~": fileURLToPath(new URL("./app", import.meta.url)) };

export default defineConfig({
  // The React Router plugin builds the app; under vitest it would try to
  // compile route modules as an app, so tests run with plain module resolution.
  plugins: process.env.VITEST ? [] : [tailwindcss(), reactRouter()],
  resolve: { alias },
  server: { host: "127.0.0.1" },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: "unit",
          env: { GAITLOOM_ENV: "test" },
          include: ["test/**/*.test.{ts,tsx}"],
          exclude: ["test/integration/**"],
          environment: "node",
        },
      },
      {
        resolve: { alias },
        test: {
          name: "integration",
          env: { GAITLOOM_ENV: "test" },
          include: ["test/integration/**/*.test.{ts,tsx}"],
          environment: "node",
          setupFiles: ["test/support/worker-database.ts"],
          testTimeout: 20_000,
          hookTimeout: 30_000,
        },
      },
    ],
  },
});
