// Lint for the whole project (run by `npm test` through `npm run lint`): ESLint's recommended rules,
// typescript-eslint's recommended rules (no type information: fast), and React's hooks rules.
import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";

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
);
