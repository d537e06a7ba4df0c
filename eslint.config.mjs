// Lint carries the architecture (DEVELOPERS.md): the pure core imports no
// React, router, database or app layer; components import no server module;
// features reach each other only through their index; browser tests take the
// shared test that fails on a policy violation. Untyped rules, so a
// run stays fast enough for every `npm test`.
import js from "@eslint/js";
import reactHooks from "eslint-plugin-react-hooks";
import tseslint from "typescript-eslint";

const FEATURES = ["accounts", "api", "compare", "gaits", "robots", "solver", "tables", "versions"];
const CORE = ["kinematics", "gait", "export"];

const coreMayNotImport = [
  { group: ["react", "react-dom", "react-dom/*", "react/*"], message: "The core is pure: no React." },
  { group: ["react-router", "@react-router/*"], message: "The core is pure: no router." },
  { group: ["drizzle-orm", "drizzle-orm/*", "postgres", "**/db/*", "**/db"], message: "The core is pure: no database." },
  {
    group: ["~/platform", "~/platform/*", "~/features", "~/features/*", "~/components/*", "~/routes/*", "~/stores/*", "**/platform/*", "**/features/*"],
    message: "The core knows nothing of the app layer.",
  },
];

/** A core module reaches another core module only through its index. */
function coreDeepImports(self) {
  return CORE.filter((other) => other !== self).map((other) => ({
    regex: `^(\\.\\./)+${other}/(?!index$).+|^~/${other}/(?!index$).+`,
    message: `Import app/${other} through its index.`,
  }));
}

/**
 * A feature reaches another feature only through its index: `index.ts` for
 * what may run in the browser, `index.server.ts` for services, kept apart so
 * a component's import chain never reaches a server module.
 */
function crossFeatureImports(self) {
  const others = FEATURES.filter((feature) => feature !== self).join("|");
  return [
    {
      regex: `^(~/features/|(\\.\\./)+)(${others})/(?!index(\\.server)?$).+`,
      message: "Another feature is reached only through its index (~/features/<feature> or ~/features/<feature>/index.server).",
    },
  ];
}

/**
 * Node's globals for the plain JavaScript files (server.js, the scripts), listed
 * here as the `globals` package is not installed; TypeScript files get theirs
 * from @types/node.
 */
const nodeGlobals = Object.fromEntries(
  [
    "process",
    "console",
    "Buffer",
    "URL",
    "URLSearchParams",
    "fetch",
    "setTimeout",
    "clearTimeout",
    "setInterval",
    "clearInterval",
    "setImmediate",
    "clearImmediate",
    "queueMicrotask",
    "structuredClone",
    "AbortController",
    "TextEncoder",
    "TextDecoder",
  ].map((name) => [name, "readonly"]),
);

export default tseslint.config(
  {
    ignores: ["build/**", ".react-router/**", "node_modules/**", ".data/**", "test-results/**", "playwright-report/**", "db/migrations/**", "public/**"],
  },
  js.configs.recommended,
  tseslint.configs.recommended,
  { files: ["**/*.{js,mjs,cjs}"], languageOptions: { globals: nodeGlobals } },
  {
    plugins: { "react-hooks": reactHooks },
    rules: {
      "react-hooks/rules-of-hooks": "error",
      "react-hooks/exhaustive-deps": "warn",
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrors: "none" }],
    },
  },
  ...CORE.map((core) => ({
    files: [`app/${core}/**/*.{ts,tsx}`],
    rules: { "no-restricted-imports": ["error", { patterns: [...coreMayNotImport, ...coreDeepImports(core)] }] },
  })),
  {
    files: ["app/components/**/*.{ts,tsx}", "app/stores/**/*.{ts,tsx}"],
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: [{ group: ["**/*.server", "**/*.server.ts"], message: "Components run in the browser: no *.server modules." }] },
      ],
    },
  },
  ...FEATURES.map((feature) => ({
    files: [`app/features/${feature}/**/*.{ts,tsx}`],
    rules: { "no-restricted-imports": ["error", { patterns: crossFeatureImports(feature) }] },
  })),
  {
    files: ["e2e/**/*.spec.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          paths: [
            { name: "@playwright/test", message: "Import test and expect from ./support/test, which fails a test on a Content-Security-Policy violation." },
          ],
        },
      ],
    },
  },
);
