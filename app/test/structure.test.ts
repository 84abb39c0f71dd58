// A house rule of issue 15 a reader can check without running the app: every page route has its own
// ErrorBoundary (components/RouteError.tsx), in that route's words. A new page without one fails here.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, test } from "vitest";
import routes from "~/routes";

const ROOT = path.resolve(__dirname, "../..");

describe("structure", () => {
  test("every page route (a module with a default export) has its own ErrorBoundary", () => {
    const files = new Set<string>();
    const visit = (list: readonly { file: string; children?: unknown }[]) => {
      for (const r of list) {
        files.add(r.file);
        if (Array.isArray(r.children)) visit(r.children as { file: string }[]);
      }
    };
    visit(routes as unknown as { file: string }[]);
    const missing = [...files].filter((f) => {
      const src = readFileSync(path.join(ROOT, "app", f), "utf8");
      return /export default function/.test(src) && !/export (const|function) ErrorBoundary/.test(src);
    });
    expect(files.size).toBeGreaterThan(20);
    expect(missing).toEqual([]);
  });
});
