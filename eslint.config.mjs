import next from "eslint-config-next";

const config = [
  ...next,
  { ignores: [".next/**", "node_modules/**", "test-results/**", "public/**"] },
  {
    rules: {
      // Tests and fakes parse loosely typed JSON on purpose.
      "@typescript-eslint/no-explicit-any": "off",
    },
  },
  {
    // One environment module: everything else asks lib/env.ts (or, in code a browser may run,
    // lib/env-shared.ts), where each variable is declared and checked once.
    files: ["app/**", "lib/**", "components/**", "db/**", "scripts/**", "migrations/**", "seeds/**", "instrumentation.ts", "proxy.ts", "middleware.ts", "knexfile.ts"],
    ignores: [
      "lib/env.ts",
      "lib/env-shared.ts",
      "lib/env-files.ts",
      // The local fakes are their own programs, started with their own variables.
      "lib/fakes/*/cli.ts",
      "lib/fakes/run-all.ts",
      "lib/fakes/stripe/state.ts",
    ],
    rules: {
      "no-restricted-properties": ["error", { object: "process", property: "env", message: "Read the environment through lib/env.ts (readEnv() or an accessor), or lib/env-shared.ts in code a browser may run." }],
    },
  },
];

export default config;
