import next from "eslint-config-next";

// The layers (DEVELOPERS.md, "Layers"): app/ and components/ → lib/services → db/, with the
// pure domain modules in lib/<domain> usable from anywhere above db/. These zones keep them
// from sliding back; each message says where the import should go instead.
const layers = {
  files: ["**/*.{ts,tsx,mjs,js}"],
  rules: {
    "import/no-restricted-paths": [
      "error",
      {
        zones: [
          {
            target: ["./app/**", "./components/**"],
            from: "./db/**",
            message: "Pages, route handlers and components reach the database only through lib/services.",
          },
          {
            target: ["./db/**"],
            from: ["./lib/services/**", "./lib/api/**", "./lib/worker/**", "./app/**", "./components/**"],
            message: "Repositories sit below the services: they take row types and return rows.",
          },
          {
            target: ["./lib/!(services|worker|api)/**"],
            from: "./lib/services/**",
            message: "Domain modules do not call use-cases; move the shared part into lib/<domain> instead.",
          },
          {
            target: ["./lib/calc/**", "./lib/match/**"],
            from: ["./db/**", "./lib/services/**", "./lib/mail/**", "./lib/media/**", "./lib/payments/stripe.ts*", "./lib/worker/**", "./migrations/**"],
            message: "Calculation and matching are pure: no database, mail, Stripe or files; the services feed them.",
          },
          {
            target: ["./app/**", "./components/**", "./lib/**"],
            from: "./lib/listings/quality.ts",
            message: "A listing's quality JSON is parsed once, by the row mapper in db/listings.ts (toListingRow): read row.quality.",
          },
          {
            target: ["./app/**", "./components/**", "./db/**", "./scripts/**", "./migrations/**", "./lib/!(fakes)/**", "./*.ts"],
            from: "./lib/fakes/**",
            message: "The local fakes are started by their own runner (npm run fakes) and imported only by tests.",
          },
        ],
      },
    ],
  },
};

// Calculation and matching may not reach for I/O packages either.
const pureCore = {
  files: ["lib/calc/**", "lib/match/**"],
  rules: {
    "no-restricted-imports": [
      "error",
      {
        patterns: [
          {
            group: ["knex", "pg", "better-sqlite3", "stripe", "cloudinary", "nodemailer", "node:fs", "fs", "node:fs/*", "fs/*", "node:net", "node:http", "node:https", "server-only"],
            message: "lib/calc and lib/match are pure: pass them data, do the I/O in lib/services or db/.",
          },
        ],
      },
    ],
  },
};

// Components run in the browser too: they may name a service's response type, never call its code.
const componentsNoServices = {
  files: ["components/**"],
  rules: {
    "@typescript-eslint/no-restricted-imports": [
      "error",
      {
        patterns: [
          {
            group: ["@/lib/services/**"],
            allowTypeImports: true,
            message: "Components take data from pages and call the API; views and pure helpers live in lib/<domain>.",
          },
        ],
      },
    ],
  },
};

// One context (lib/context.ts): a use-case or a job takes its database and its clock from the
// context it is given, so a test or the worker that fixes either fixes it everywhere.
const oneContext = {
  files: ["lib/services/**", "lib/mail/deliver-outbox.ts"],
  rules: {
    "no-restricted-syntax": [
      "error",
      {
        selector: "NewExpression[callee.name='Date'][arguments.length=0]",
        message: "Read the time from the context: const { clock } = resolveContext(ctx); const now = clock();",
      },
      {
        selector: "CallExpression[callee.object.name='Date'][callee.property.name='now']",
        message: "Read the time from the context's clock (resolveContext(ctx).clock); wall-clock throttles say why in a disable comment.",
      },
    ],
    "no-restricted-imports": [
      "error",
      {
        paths: [{ name: "@/db/index", importNames: ["db"], message: "Use the context's database: const { db: q } = resolveContext(ctx), and pass q to the repositories." }],
      },
    ],
  },
};

const config = [
  ...next,
  { ignores: [".next/**", "node_modules/**", "test-results/**", "public/**"] },
  {
    files: ["**/*.{ts,tsx,mts,cts,mjs,js,jsx}"],
    rules: {
      // Tests and fakes parse loosely typed JSON on purpose.
      "@typescript-eslint/no-explicit-any": "off",
      // One direction for every import: lib/payments never reaches back into lib/services.
      "import/no-cycle": ["error", { ignoreExternal: true }],
    },
  },
  layers,
  pureCore,
  componentsNoServices,
  oneContext,
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
