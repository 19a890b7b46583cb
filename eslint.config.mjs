import tseslint from "typescript-eslint";

// The engine is pure computation: no framework, storage, queue, clock, randomness or environment.
const engineForbidden = {
  patterns: [
    { group: ["next", "next/*", "react", "react/*", "react-dom", "drizzle-orm", "drizzle-orm/*", "postgres", "bullmq", "ioredis", "node:*", "fs", "path", "os", "crypto", "child_process"], message: "lib/engine is pure: no framework, database, queue or Node imports." },
    { group: ["@/*", "../../*"], message: "lib/engine imports only itself." },
  ],
};

export default tseslint.config(
  { ignores: ["node_modules/**", ".next*/**", ".local/**", "drizzle/**", "next-env.d.ts"] },
  ...tseslint.configs.recommended,
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  {
    files: ["lib/engine/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", engineForbidden],
      "no-restricted-globals": ["error", "process", "Date", "setTimeout", "setInterval", "fetch", "performance"],
      "no-restricted-properties": ["error", { object: "Math", property: "random", message: "lib/engine is deterministic." }],
    },
  },
);
