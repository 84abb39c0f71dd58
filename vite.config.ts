import { reactRouter } from "@react-router/dev/vite";
import { configDefaults, defineConfig, type Plugin } from "vitest/config";
import { CLIENT_IP_HEADER } from "./app/lib/shared/client-address.ts";

// One config for the app and for vitest: under vitest the React Router plugin is left out
// (it expects a full app build), and tsconfig paths are resolved by Vite itself.
const underVitest = Boolean(process.env.VITEST);

/**
 * The dev server (npm run dev) hands the app the client address as app/serve.mjs does: the socket's,
 * always overwriting what a client sent under that name (sign-in throttling and the dev mailbox read it).
 */
const clientAddress = (): Plugin => ({
  name: "dutymark-client-address",
  configureServer(server) {
    server.middlewares.use((req, _res, next) => {
      req.headers[CLIENT_IP_HEADER] = req.socket.remoteAddress ?? "";
      next();
    });
  },
});

export default defineConfig({
  plugins: underVitest ? [] : [clientAddress(), reactRouter()],
  resolve: { tsconfigPaths: true },
  server: { host: "127.0.0.1" },
  // The service worker, the field pages' manifest and our icons, served at the site's root (the top level holds only
  // what the product owner lists: no public/ there).
  publicDir: "app/public",
  test: {
    include: ["app/**/*.test.ts", "db/**/*.test.ts", "fixtures/**/*.test.ts"],
    // The Galera tests need galera-4 and rsync and real clusters: `npm run test:cluster` runs them (the start tests
    // with DUTYMARK_GALERA_TESTS=1, the cluster checks with CLUSTER_NODE_URLS set to its nodes); `npm test` leaves
    // them out rather than skipping them.
    exclude: [
      ...configDefaults.exclude,
      ...(process.env.DUTYMARK_GALERA_TESTS ? [] : ["app/test/galera-start.test.ts"]),
      ...(process.env.CLUSTER_NODE_URLS ? [] : ["app/test/cluster.test.ts"]),
    ],
    environment: "node",
    testTimeout: 20_000,
    hookTimeout: 60_000,
    fileParallelism: false,
  },
});
