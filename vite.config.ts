import { reactRouter } from "@react-router/dev/vite";
import { defineConfig } from "vitest/config";

// One config for the app and for vitest: under vitest the React Router plugin is left out
// (it expects a full app build), and tsconfig paths are resolved by Vite itself.
const underVitest = Boolean(process.env.VITEST);

export default defineConfig({
  plugins: underVitest ? [] : [reactRouter()],
  resolve: { tsconfigPaths: true },
  server: { host: "127.0.0.1" },
  test: {
    include: ["app/**/*.test.ts", "db/**/*.test.ts", "fixtures/**/*.test.ts"],
    environment: "node",
    testTimeout: 20_000,
    hookTimeout: 60_000,
    fileParallelism: false,
  },
});
