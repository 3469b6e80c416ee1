import type { Config } from "@react-router/dev/config";

export default {
  ssr: true,
  appDirectory: "app",
  // EONSCALE_BUILD_DIR lets parallel test runs keep separate builds (default "build").
  buildDirectory: process.env.EONSCALE_BUILD_DIR || "build",
  future: {
    v8_middleware: false,
  },
} satisfies Config;
