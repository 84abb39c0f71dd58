import path from "node:path";
import type { Config } from "@react-router/dev/config";

export default {
  appDirectory: "app",
  ssr: true,
  future: { v8_middleware: true },
  // The upload analysis runs in a worker thread (app/lib/libraries/upload-analysis.server.ts); its entry is
  // bundled next to the server build, where the server looks for it.
  async buildEnd({ reactRouterConfig }) {
    const { build } = await import("esbuild");
    await build({
      entryPoints: ["app/lib/libraries/upload-analysis.worker.ts"],
      outfile: path.join(reactRouterConfig.buildDirectory, "server", "upload-analysis-worker.mjs"),
      bundle: true,
      packages: "external", // node_modules at run time, as for the server build (the worker reads uploads through the mariadb connector)
      platform: "node",
      format: "esm",
      target: "node20",
      jsx: "automatic",
      logLevel: "warning",
    });
  },
} satisfies Config;
