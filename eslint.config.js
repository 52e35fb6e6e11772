// ESLint 9 flat config. The import rules below encode the layers (DEVELOPERS.md, "Layers"):
// the pure core in app/lib imports nothing above it and no framework, database or Node API;
// components take plain data and never import server-only modules.
import js from "@eslint/js";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import tseslint from "typescript-eslint";

const NODE_BUILTINS = [
  "assert",
  "buffer",
  "child_process",
  "crypto",
  "fs",
  "http",
  "https",
  "net",
  "os",
  "path",
  "process",
  "stream",
  "url",
  "util",
  "worker_threads",
  "zlib",
];

export default tseslint.config(
  { ignores: ["build/", "node_modules/", ".react-router/", "data/", "test-results/", "playwright-report/", "coverage/"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrors: "none" }],
      "@typescript-eslint/consistent-type-imports": ["error", { fixStyle: "inline-type-imports" }],
    },
  },
  {
    files: ["app/**/*.tsx"],
    plugins: { "react-hooks": reactHooks },
    rules: {
      "react-hooks/rules-of-hooks": "error",
      "react-hooks/exhaustive-deps": "warn",
    },
  },
  {
    files: ["app/lib/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: [
                "~/routes/*",
                "~/models/*",
                "~/utils/*",
                "~/components/*",
                "**/routes/**",
                "**/models/**",
                "**/utils/**",
                "**/components/**",
              ],
              message: "app/lib is the pure core: it imports nothing from routes, models, utils or components.",
            },
            {
              group: ["react", "react/*", "react-dom", "react-dom/*", "react-router", "react-router/*", "@react-router/*"],
              message: "app/lib stays free of React and the router.",
            },
            { group: ["knex", "knex/*", "better-sqlite3"], message: "app/lib never touches the database." },
            { group: ["node:*", ...NODE_BUILTINS], message: "app/lib uses no Node API." },
          ],
        },
      ],
    },
  },
  {
    files: ["app/components/**/*.tsx", "app/components/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: ["**/*.server", "**/*.server.ts", "~/models/*", "~/routes/*"],
              message: "Components take plain data: no server-only modules, models or routes (types live in app/lib).",
            },
          ],
        },
      ],
    },
  },
);
