import { reactRouter } from "@react-router/dev/vite";
import tailwindcss from "@tailwindcss/vite";
import { defineConfig } from "vitest/config";

// One config for the app and for Vitest. Under Vitest the React Router plugin stays out:
// unit and integration tests import modules directly and never build routes.
const underVitest = Boolean(process.env.VITEST);

export default defineConfig({
  plugins: underVitest ? [] : [tailwindcss(), reactRouter()],
  resolve: { tsconfigPaths: true },
  build: { sourcemap: process.env.BUILD_SOURCEMAP ? "hidden" : false },
  server: { port: 3000 },
  test: {
    include: ["tests/**/*.test.ts"],
    // *.pg.test.ts are about PostgreSQL itself (row security, its query plans): scripts/test-pg.mjs runs them
    exclude: ["tests/e2e/**", "node_modules/**", ...(process.env.TEST_DATABASE_URL ? [] : ["tests/**/*.pg.test.ts"])],
    environment: "node",
    globalSetup: ["tests/setup/global-setup.ts"],
    setupFiles: ["tests/setup/setup-file.ts"],
    pool: "forks",
    execArgv: ["--import", "tsx"],
    testTimeout: 20_000,
    // the matrix and fuzz files' beforeAll imports every route module and signs people in: on a busy
    // two-core machine that takes longer than the 10 s default
    hookTimeout: 60_000,
  },
});
