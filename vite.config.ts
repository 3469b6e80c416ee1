/// <reference types="vitest/config" />
import { reactRouter } from "@react-router/dev/vite";
import tailwindcss from "@tailwindcss/vite";
import { defineConfig } from "vite";

const isTest = Boolean(process.env.VITEST);

export default defineConfig(({ isSsrBuild }) => ({
  // The React Router plugin is left out under vitest: tests import modules directly.
  plugins: isTest ? [] : [tailwindcss(), reactRouter()],
  resolve: {
    tsconfigPaths: true,
  },
  build: {
    target: "es2022",
    // The server build's entry is the Express app, which imports React Router's server build:
    // the app, its routes and every server module end up in one module graph (server/app.ts).
    rollupOptions: isSsrBuild ? { input: "./server/app.ts" } : undefined,
  },
  test: {
    // Two cores: two test files at a time (Postgres and the stand-ins need some CPU too).
    maxWorkers: 2,
    projects: [
      {
        extends: true,
        test: {
          name: "unit",
          include: ["app/**/*.test.ts", "tests/unit/**/*.test.ts"],
          environment: "node",
        },
      },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          globalSetup: ["tests/setup/global-setup.ts"],
          setupFiles: ["tests/setup/per-file.ts"],
          testTimeout: 30_000,
          hookTimeout: 60_000,
          // Each file gets its own copy of the template database (tests/setup/per-file.ts).
          fileParallelism: true,
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          environment: "node",
          globalSetup: ["tests/setup/global-setup.ts", "tests/setup/e2e-server.ts"],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          // Two files at a time: they share the one app server (each makes its own rows) and mostly wait
          // on Chromium and the server, so two overlap well on 2 cores (npm test stays under 10 minutes).
          fileParallelism: true,
          maxWorkers: 2,
          // Pages wait on the server and background jobs: poll for up to 20 s, not vitest's 1 s.
          expect: { poll: { timeout: 20_000 } },
        },
      },
    ],
  },
}));
