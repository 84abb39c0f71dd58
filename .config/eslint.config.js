// Lint for the whole project (run by `npm test` through `npm run lint`): ESLint's recommended rules,
// typescript-eslint's recommended rules (no type information: fast), and React's hooks rules.
import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";

// Layering rules (below) and the files they leave alone.
const TEST_AND_SCRIPTS = ["**/*.test.ts", "**/*.test.tsx", "app/test/**", "app/bench/**", "app/cli/**", "app/engine/test/**", "app/lib/import/test-helpers.ts", "app/lib/**/test-kit.ts", "app/components/chart/test-pumps.ts"];
const NO_FIXTURES = { group: ["**/fixtures/*", "**/fixtures/**"], message: "The app's runtime code imports nothing from fixtures/ (test data and stand-ins)." };
const NO_SERVER_MODULES = { group: ["*.server", "**/*.server", "**/*.server.ts", "**/*.server.tsx"], message: "Components run in the browser: no .server module (not even for a type: move the type beside the component or to a shared module)." };
const NO_DB = { group: ["@db/*", "**/db/*"], message: "Only services (*.server.ts) reach the database." };

export default tseslint.config(
  { ignores: ["node_modules/", "build/", ".react-router/", ".data/", "e2e/artifacts/", "playwright-report/", "test-results/"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ["**/*.{ts,tsx,js,mjs}"],
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      // Unused names are errors, except ones marked unused on purpose with a leading underscore.
      // An empty catch says "ignore this failure" on purpose (best-effort cleanup); other empty blocks are errors.
      "no-empty": ["error", { allowEmptyCatch: true }],
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrors: "none" }],
    },
  },
  {
    files: ["app/**/*.tsx", "app/components/**/*.ts"],
    plugins: { "react-hooks": reactHooks },
    rules: {
      "react-hooks/rules-of-hooks": "error",
      "react-hooks/exhaustive-deps": "error",
    },
  },
  {
    // The Stripe stand-in speaks Stripe's loosely shaped JSON (expandable fields, form-encoded
    // nesting): its store, form parser and tests type those objects as `any` on purpose.
    files: ["fixtures/stripe/**"],
    rules: { "@typescript-eslint/no-explicit-any": "off" },
  },
  // ── Layering: which folder may import what (DEVELOPERS.md, "Folder map"). ──────────────────
  // ESLint applies the last matching block's option for a rule, so each block repeats what applies to it.
  {
    // The app's runtime code never imports test fixtures (tests, benchmarks and the CLI's demo seed may).
    files: ["app/**/*.{ts,tsx}"],
    ignores: TEST_AND_SCRIPTS,
    rules: { "no-restricted-imports": ["error", { patterns: [NO_FIXTURES] }] },
  },
  {
    // Components run in the browser: no server module, no database.
    files: ["app/components/**/*.{ts,tsx}"],
    ignores: TEST_AND_SCRIPTS,
    rules: { "no-restricted-imports": ["error", { patterns: [NO_FIXTURES, NO_SERVER_MODULES, NO_DB] }] },
  },
  {
    // The field-check modules the phone runs offline (public face index.ts): no server module, no database.
    files: ["app/lib/fieldchecks/*.ts"],
    ignores: [...TEST_AND_SCRIPTS, "app/lib/fieldchecks/*.server.ts"],
    rules: { "no-restricted-imports": ["error", { patterns: [NO_FIXTURES, NO_SERVER_MODULES, NO_DB] }] },
  },
  {
    // The engine is pure: nothing of the app, the database, React or Node (it runs in the browser too).
    files: ["app/engine/**/*.ts"],
    ignores: ["app/engine/**/*.test.ts", "app/engine/test/**"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            NO_FIXTURES,
            NO_DB,
            { group: ["~/*", "../*", "!../index.ts", "!../*.ts"], message: "The engine imports nothing of the app: only its own modules (./x.ts)." },
            { group: ["react", "react-*", "react-router", "drizzle-orm", "drizzle-orm/*", "node:*"], message: "The engine is pure TypeScript: no React, Drizzle or Node APIs." },
          ],
        },
      ],
    },
  },
  {
    // The database layer (schema, client, migrations, MariaDB scripts) imports nothing of the app.
    files: ["db/**/*.{ts,mjs}"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [{ group: ["~/*", "**/app/*", "**/app/**"], message: "db/ imports nothing of app/: move shared lists to db/enums.ts, scripts that wire services to app/cli/." }] }],
    },
  },
);
