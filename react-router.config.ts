import type { Config } from "@react-router/dev/config";

export default {
  ssr: true,
  appDirectory: "app",
  buildDirectory: "build",
  // Root middleware guards every mutation's origin in one place.
  future: { v8_middleware: true },
} satisfies Config;
