// ESLint (flat config): the TypeScript rules and the React hooks rules, run by `npm run lint`
// (part of `npm test`). Layer rules live in .dependency-cruiser.cjs, not here.
import js from "@eslint/js";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import tseslint from "typescript-eslint";

export default tseslint.config(
  // tests/unit/scale/oracle/ is a frozen copy of the old scale engine kept as a test oracle: it stays as it was.
  { ignores: ["tests/unit/scale/oracle/", "build/", "build-*/", ".react-router/", "node_modules/", ".data/", "test-results/", "db/data/ics/source/"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrorsIgnorePattern: "^_" }],
      "@typescript-eslint/consistent-type-imports": ["error", { fixStyle: "inline-type-imports", disallowTypeAnnotations: false }],
      "no-console": "off",
    },
  },
  {
    // Tests read arbitrary JSON bodies; typing every one would add noise, not safety.
    files: ["tests/**/*.ts"],
    rules: { "@typescript-eslint/no-explicit-any": "off" },
  },
  {
    files: ["app/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
);
