// The project's lint: typescript-eslint's recommended rules, and the boundaries of the house rules
// (DEVELOPERS.md): the domain core under src/lib (outside src/lib/server and src/lib/db) imports no
// framework, database, auth or Node built-in, and no browser island imports server code.
import js from "@eslint/js";
import tseslint from "typescript-eslint";

const CORE_FORBIDDEN = [
  { group: ["astro", "astro:*", "astro/*", "@astrojs/*"], message: "The domain core is framework-free (DEVELOPERS.md, Core first)." },
  { group: ["react", "react-dom", "react/*", "@xyflow/*"], message: "The domain core is framework-free (DEVELOPERS.md, Core first)." },
  { group: ["drizzle-orm", "drizzle-orm/*", "postgres"], message: "The domain core does no I/O: database access lives in src/lib/server." },
  { group: ["better-auth", "better-auth/*"], message: "Sign-in lives in src/lib/server/auth.ts." },
  { group: ["node:*"], message: "The domain core does no I/O: Node built-ins belong in src/lib/server, scripts or the CLI." },
  { group: ["**/server/*", "**/server/**"], message: "The domain core never imports server code." },
];

export default tseslint.config(
  { ignores: ["node_modules/**", "dist/**", ".build/**", ".astro/**", ".data/**", "test-results/**", "public/**", "drizzle/**", "**/*.astro"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { ecmaVersion: 2023, sourceType: "module", globals: { console: "readonly", process: "readonly", URL: "readonly", fetch: "readonly", setTimeout: "readonly", clearTimeout: "readonly", setInterval: "readonly", clearInterval: "readonly", Buffer: "readonly", structuredClone: "readonly", TextEncoder: "readonly", TextDecoder: "readonly", AbortController: "readonly", Headers: "readonly", Request: "readonly", Response: "readonly", queueMicrotask: "readonly" } },
    rules: {
      "@typescript-eslint/no-explicit-any": "off",
      // Input checks match control characters on purpose (text without NUL or other control characters).
      "no-control-regex": "off",
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrors: "none" }],
    },
  },
  {
    files: ["src/lib/**/*.ts"],
    // auth-client.ts is the browser's sign-in client (better-auth's React client), not domain core.
    ignores: ["src/lib/server/**", "src/lib/db/**", "src/lib/auth-client.ts"],
    rules: { "no-restricted-imports": ["error", { patterns: CORE_FORBIDDEN }] },
  },
  {
    files: ["src/components/**/*.{ts,tsx}"],
    rules: { "no-restricted-imports": ["error", { patterns: [{ group: ["**/lib/server/*", "**/lib/server/**"], message: "Browser islands never import server code." }, { group: ["**/lib/db/**"], message: "Browser islands never import the database schema." }] }] },
  },
);
