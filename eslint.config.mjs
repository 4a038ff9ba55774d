// ESLint flat config: Next's rules (core web vitals + TypeScript) plus the layer directions
// of CONVENTIONS.md §3, enforced with no-restricted-imports. Import specifiers are matched
// both in the `@/` alias form and in relative form (`../db/knex`, `../../lib/db`).
import { builtinModules } from "node:module";
import nextCoreWebVitals from "eslint-config-next/core-web-vitals";
import nextTypescript from "eslint-config-next/typescript";

/** A regex matching `@/<folder>`, `./<folder>` or `../../<folder>` (with or without `lib/`). */
function ours(folder) {
  const f = folder.replace(/\//g, "\\/");
  return `^(?:@\\/|(?:\\.\\.?\\/)+)${f.startsWith("lib\\/") ? `(?:lib\\/)?${f.slice(5)}` : f}(?:\\/|$)`;
}

function restrict(entries) {
  return {
    "no-restricted-imports": [
      "error",
      { patterns: entries.map(([regex, message]) => ({ regex, message })) },
    ],
  };
}

const NODE_BUILTINS = `^(?:node:.*|${builtinModules.filter((m) => !m.startsWith("_")).map((m) => m.replace(/\//g, "\\/")).join("|")})(?:\\/.*)?$`;
const NEXT = "^next(?:\\/.*)?$";
const NEXT_AUTH_SERVER = "^next-auth(?:\\/(?!react$).*)?$";

const uiRules = restrict([
  [ours("lib/db"), "UI code never imports the database (CONVENTIONS §3)."],
  [ours("lib/services"), "UI code never imports services; go through actions or /api/v1 (CONVENTIONS §3)."],
  [ours("lib/auth/session"), "UI code never imports session helpers (CONVENTIONS §3)."],
  [ours("lib/auth/options"), "UI code never imports next-auth server options (CONVENTIONS §3)."],
  [NEXT_AUTH_SERVER, "Only next-auth/react may be imported by UI code (CONVENTIONS §3)."],
  ["^knex$", "UI code never imports knex (CONVENTIONS §3)."],
]);

const numericalRules = restrict([
  [NEXT, "The numerical library imports nothing from Next (CONVENTIONS §3, §7)."],
  [NODE_BUILTINS, "The numerical library runs in the browser too: no Node built-ins (CONVENTIONS §3)."],
  ["^knex$", "The numerical library never touches the database (CONVENTIONS §3)."],
  [ours("lib/config"), "The numerical library never reads the environment (CONVENTIONS §3)."],
  [ours("lib/db"), "The numerical library never touches the database (CONVENTIONS §3)."],
  [ours("lib/services"), "The numerical library imports nothing of the app (CONVENTIONS §3)."],
  [ours("lib/jobs"), "The numerical library imports nothing of the app (CONVENTIONS §3)."],
  [ours("lib/http"), "The numerical library imports nothing of the app (CONVENTIONS §3)."],
  [ours("lib/auth"), "The numerical library imports nothing of the app (CONVENTIONS §3)."],
  [ours("lib/email"), "The numerical library imports nothing of the app (CONVENTIONS §3)."],
  [ours("lib/storage"), "The numerical library imports nothing of the app (CONVENTIONS §3)."],
  [ours("app"), "The numerical library imports nothing of the app (CONVENTIONS §3)."],
  [ours("components"), "The numerical library imports nothing of the app (CONVENTIONS §3)."],
]);

const workerRules = restrict([
  [ours("app"), "Workers never import app/ (CONVENTIONS §3)."],
  [NEXT, "Workers never import next/* (CONVENTIONS §3)."],
  [NEXT_AUTH_SERVER, "Workers never import next-auth (CONVENTIONS §3)."],
  ["^server-only$", "Workers run outside Next: server-only would throw (CONVENTIONS §3)."],
]);

const serviceRules = restrict([
  [ours("app"), "Services never import app/ (CONVENTIONS §3)."],
  [ours("components"), "Services never import components/ (CONVENTIONS §3)."],
]);

const NUMERICAL = ["numeric", "signal", "linalg", "modal", "stats", "simulate"].map((d) => `lib/${d}/**`);

export default [
  {
    ignores: [
      "node_modules/**",
      ".next/**",
      ".data/**",
      ".test-data/**",
      ".tmp/**",
      "coverage/**",
      "test-results/**",
      "public/**",
      "next-env.d.ts",
    ],
  },
  ...nextCoreWebVitals,
  ...nextTypescript,
  {
    rules: {
      "@typescript-eslint/no-explicit-any": "error",
      "@typescript-eslint/ban-ts-comment": [
        "error",
        { "ts-ignore": true, "ts-nocheck": true, "ts-expect-error": "allow-with-description" },
      ],
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  {
    // process.env is read only by the env module (CONVENTIONS §10); launchers and tests excepted.
    files: ["app/**", "components/**", "lib/**", "workers/**", "db/**", "scripts/**/*.ts"],
    ignores: ["lib/config/env.ts"],
    rules: {
      "no-restricted-properties": [
        "error",
        { object: "process", property: "env", message: "Read configuration through env() in lib/config/env.ts." },
      ],
    },
  },
  { files: ["components/**", "lib/client/**"], rules: uiRules },
  { files: NUMERICAL, rules: numericalRules },
  { files: ["workers/**"], rules: workerRules },
  { files: ["lib/services/**"], rules: serviceRules },
  {
    // Plain Node launchers run before node_modules exist and may read process.env.
    files: ["scripts/**/*.mjs", "eslint.config.mjs"],
    rules: { "import/no-anonymous-default-export": "off" },
  },
];
