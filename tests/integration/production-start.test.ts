// A production start refuses to run on missing or public demo secrets (lib/env.ts), in
// every entry point: the database CLI (migrate and seed, run first by `npm start`), the
// worker, the fakes and the app's instrumentation hook. `next start` itself is tried
// against the production build in tests/e2e/security.spec.ts.
import { spawnSync } from "node:child_process";
import os from "node:os";
import path from "node:path";
import fs from "node:fs";
import { afterEach, describe, expect, it, vi } from "vitest";
import { DEMO_SECRETS, SECRETS, checkStartup, startupProblems } from "@/lib/env";

const REAL = { NEXTAUTH_SECRET: "q9Vb1y1m1f0nH2c7m2mXv0Zq3Jc8wqkT0vYzY2Qf1aA=", LOCATION_SECRET: "Zr6m0K1mN3wq8vQ2yX5dP7sT9uB4eH6jL0cF2gA1iE=", STRIPE_WEBHOOK_SECRET: "whsec_9sKq2mV7xL4pN1bT6yR3" };
const root = path.resolve(__dirname, "../..");

function run(script: string, args: string[], env: Record<string, string>) {
  const base: Record<string, string> = { PATH: process.env.PATH ?? "", HOME: process.env.HOME ?? os.tmpdir() };
  const out = spawnSync(process.execPath, ["--conditions=react-server", "--import", "tsx", script, ...args], { cwd: root, env: { ...base, ...env } as unknown as NodeJS.ProcessEnv, encoding: "utf8", timeout: 60_000 });
  return { code: out.status, stderr: out.stderr, stdout: out.stdout };
}

describe("which secrets a production start needs", () => {
  const cases: [string, Record<string, string | undefined>, RegExp[]][] = [
    ["nothing set", {}, SECRETS.map((s) => new RegExp(`^${s.name} is not set.*openssl rand -base64 32`))],
    ...SECRETS.map((s): [string, Record<string, string | undefined>, RegExp[]] => [`${s.name} missing`, { ...REAL, [s.name]: undefined }, [new RegExp(`^${s.name} is not set\\. It .*Set it to .*openssl rand -base64 32`)]]),
    ...SECRETS.map((s): [string, Record<string, string | undefined>, RegExp[]] => [`${s.name} empty`, { ...REAL, [s.name]: "  " }, [new RegExp(`^${s.name} is not set`)]]),
    ...SECRETS.map((s): [string, Record<string, string | undefined>, RegExp[]] => [`${s.name} the demo value`, { ...REAL, [s.name]: DEMO_SECRETS[s.name] }, [new RegExp(`^${s.name} is the public demo value`)]]),
    ["a malformed APP_URL", { ...REAL, APP_URL: "duffbank.example.org" }, [/^APP_URL must be an http\(s\) URL/]],
    ["every secret set", { ...REAL }, []],
  ];
  it.each(cases)("%s", (_name, env, expected) => {
    const lines = startupProblems({ NODE_ENV: "production", ...env });
    expect(lines).toHaveLength(expected.length);
    expected.forEach((re, i) => expect(lines[i]).toMatch(re));
  });

  it("asks nothing outside production, nor of the explicit demo (which warns instead)", () => {
    expect(startupProblems({ NODE_ENV: "development" })).toEqual([]);
    expect(startupProblems({})).toEqual([]);
    expect(startupProblems({ NODE_ENV: "production", DUFFBANK_DEMO: "1" })).toEqual([]);
    const lines: string[] = [];
    checkStartup("app", { NODE_ENV: "production", DUFFBANK_DEMO: "1" }, { error: (l) => lines.push(l), exit: () => { throw new Error("must not exit"); } });
    expect(lines.join("\n")).toMatch(/PUBLIC DEMO SECRETS/);
  });
});

describe("the app's instrumentation hook", () => {
  afterEach(() => vi.unstubAllEnvs());

  it("exits before serving when a production start lacks its secrets, naming each", async () => {
    vi.stubEnv("NODE_ENV", "production");
    vi.stubEnv("NEXT_RUNTIME", "nodejs");
    vi.stubEnv("NEXT_PHASE", "");
    vi.stubEnv("DUFFBANK_DEMO", "");
    for (const s of SECRETS) vi.stubEnv(s.name, "");
    const errors: string[] = [];
    const err = vi.spyOn(console, "error").mockImplementation((l: string) => void errors.push(l));
    const exit = vi.spyOn(process, "exit").mockImplementation(((code: number) => {
      throw new Error(`exit ${code}`);
    }) as never);
    const { register } = await import("@/instrumentation");
    await expect(register()).rejects.toThrow("exit 1");
    for (const s of SECRETS) expect(errors.join("\n")).toContain(`[app] ${s.name} is not set`);
    // A build (NEXT_PHASE) needs no secrets.
    vi.stubEnv("NEXT_PHASE", "phase-production-build");
    await expect(register()).resolves.toBeUndefined();
    err.mockRestore();
    exit.mockRestore();
  });
});

describe("the command-line entry points", () => {
  const file = path.join(os.tmpdir(), `duffbank-start-${process.pid}.sqlite`);
  afterEach(() => {
    for (const f of [file, `${file}-wal`, `${file}-shm`]) fs.rmSync(f, { force: true });
  });

  it.each([
    ["db:migrate", "scripts/db.ts", ["migrate"]],
    ["db:seed", "scripts/db.ts", ["seed"]],
    ["the worker", "lib/worker/run.ts", ["--once", "deliver-outbox"]],
  ])("%s refuses a production start with no secrets, one line per secret, and touches nothing", (_name, script, args) => {
    const out = run(script, args, { NODE_ENV: "production", DATABASE_FILE: file });
    expect(out.code).toBe(1);
    for (const s of SECRETS) expect(out.stderr).toMatch(new RegExp(`\\] ${s.name} is not set\\..*openssl rand -base64 32`));
    expect(out.stderr).toMatch(/Refusing to start/);
    expect(fs.existsSync(file)).toBe(false);
  });

  it("db:migrate runs in production once the secrets are set, and in the explicit demo with a warning", () => {
    const real = run("scripts/db.ts", ["migrate"], { NODE_ENV: "production", DATABASE_FILE: file, ...REAL });
    expect(real.code, real.stderr).toBe(0);
    expect(real.stderr).not.toMatch(/DEMO/);
    const demo = run("scripts/db.ts", ["migrate"], { NODE_ENV: "production", DATABASE_FILE: file, DUFFBANK_DEMO: "1" });
    expect(demo.code, demo.stderr).toBe(0);
    expect(demo.stderr).toMatch(/PUBLIC DEMO SECRETS/);
  });

  it("development needs nothing set", () => {
    const dev = run("scripts/db.ts", ["migrate"], { DATABASE_FILE: file });
    expect(dev.code, dev.stderr).toBe(0);
  });
});
