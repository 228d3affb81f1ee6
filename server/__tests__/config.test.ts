import { mkdtempSync, readFileSync, statSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ConfigError, loadConfig, loadSessionSecret, parseEnv } from "../config.js";

describe("parseEnv", () => {
  it("applies the defaults: PORT 3000, PGPORT 54329, demo seed", () => {
    const env = parseEnv({});
    expect(env).toMatchObject({ PORT: 3000, PGPORT: 54329, STILLSPAN_SEED: "demo", TRUST_PROXY: false });
    expect(env.DATABASE_URL).toBeUndefined();
  });

  it("lists every bad variable at once", () => {
    let error: unknown;
    try {
      parseEnv({ PORT: "abc", PGPORT: "70000", STILLSPAN_SEED: "maybe", DATABASE_URL: "mysql://x/y" });
    } catch (err) {
      error = err;
    }
    expect(error).toBeInstanceOf(ConfigError);
    const problems = (error as ConfigError).problems.map((p) => p.split(":")[0]).sort();
    expect(problems).toEqual(["DATABASE_URL", "PGPORT", "PORT", "STILLSPAN_SEED"]);
  });

  it("takes STILLSPAN_PUBLIC_URL as an http(s) origin only, and refuses a path, credentials or another scheme", () => {
    expect(parseEnv({ STILLSPAN_PUBLIC_URL: "https://stillspan.example.org/" }).STILLSPAN_PUBLIC_URL).toBe("https://stillspan.example.org/");
    expect(loadConfig({ STILLSPAN_PUBLIC_URL: "https://stillspan.example.org:8443/", STILLSPAN_SESSION_SECRET: "s".repeat(32) }).publicUrl).toBe(
      "https://stillspan.example.org:8443",
    );
    for (const bad of ["ftp://stillspan.example.org", "https://stillspan.example.org/app", "https://user:pw@stillspan.example.org", "not a url"]) {
      expect(() => parseEnv({ STILLSPAN_PUBLIC_URL: bad }), bad).toThrow(/STILLSPAN_PUBLIC_URL/);
    }
  });

  it("takes DATABASE_OWNER_URL for migrations only together with DATABASE_URL for the app", () => {
    const env = { DATABASE_URL: "postgres://app:a@db/stillspan", DATABASE_OWNER_URL: "postgres://owner:o@db/stillspan" };
    expect(loadConfig({ ...env, STILLSPAN_SESSION_SECRET: "s".repeat(32) })).toMatchObject({
      databaseUrl: env.DATABASE_URL,
      databaseOwnerUrl: env.DATABASE_OWNER_URL,
    });
    expect(() => parseEnv({ DATABASE_OWNER_URL: env.DATABASE_OWNER_URL })).toThrow(/set DATABASE_URL too/);
  });

  it("tells a set PGPORT from the default one", () => {
    const secret = { STILLSPAN_SESSION_SECRET: "s".repeat(32) };
    expect(loadConfig(secret)).toMatchObject({ pgPort: 54329, pgPortExplicit: false });
    expect(loadConfig({ ...secret, PGPORT: "54330" })).toMatchObject({ pgPort: 54330, pgPortExplicit: true });
  });

  it("requires the first-admin e-mail and password together", () => {
    expect(() => parseEnv({ STILLSPAN_ADMIN_EMAIL: "ops@example.org" })).toThrow(/set both or neither/);
  });
});

describe("sweep pool and request limits", () => {
  const base = { STILLSPAN_SESSION_SECRET: "s".repeat(32) };

  it("reads the sweep pool's settings and the request timeouts, with their defaults", () => {
    const config = loadConfig(base);
    expect(config.sweeps).toEqual({ workers: 2, computeLimitMs: 20_000, queueLimit: 8, queuePerUser: 3, maxWaitMs: 30_000, maxSolvedSteps: 30_000 });
    expect(config.http).toEqual({ headersTimeoutMs: 20_000, requestTimeoutMs: 60_000 });
    const tuned = loadConfig({ ...base, STILLSPAN_SWEEP_WORKERS: "4", STILLSPAN_SWEEP_QUEUE: "0", STILLSPAN_SWEEP_MAX_SOLVED_STEPS: "90000", STILLSPAN_REQUEST_TIMEOUT_MS: "5000", STILLSPAN_HEADERS_TIMEOUT_MS: "" });
    expect(tuned.sweeps).toMatchObject({ workers: 4, queueLimit: 0, maxSolvedSteps: 90_000 });
    // Without its own value, the headers timeout is 20 s or the request timeout when that is shorter.
    expect(tuned.http).toEqual({ headersTimeoutMs: 5000, requestTimeoutMs: 5000 });
  });

  it("refuses a bad sweep setting instead of silently using the default", () => {
    let error: unknown;
    try {
      parseEnv({ STILLSPAN_SWEEP_WORKERS: "0", STILLSPAN_SWEEP_TIMEOUT_MS: "soon", STILLSPAN_SWEEP_QUEUE_PER_USER: "1.5" });
    } catch (err) {
      error = err;
    }
    expect(error).toBeInstanceOf(ConfigError);
    expect((error as ConfigError).problems).toEqual([
      "STILLSPAN_SWEEP_WORKERS: must be at least 1",
      "STILLSPAN_SWEEP_TIMEOUT_MS: must be a whole number",
      "STILLSPAN_SWEEP_QUEUE_PER_USER: must be a whole number",
    ]);
  });

  it("refuses a headers timeout longer than the request timeout (Node would throw at start)", () => {
    expect(() => parseEnv({ STILLSPAN_HEADERS_TIMEOUT_MS: "9000", STILLSPAN_REQUEST_TIMEOUT_MS: "8000" })).toThrow(/HEADERS_TIMEOUT_MS/);
  });
});

describe("loadSessionSecret", () => {
  it("generates a secret on first start, stores it with mode 0600 and reuses it", () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), "stillspan-config-"));
    const first = loadSessionSecret(dir);
    const second = loadSessionSecret(dir);
    const file = path.join(dir, "session-secret");

    expect(first.length).toBeGreaterThanOrEqual(32);
    expect(Buffer.from(second).equals(Buffer.from(first))).toBe(true);
    expect(statSync(file).mode & 0o777).toBe(0o600);
    expect(readFileSync(file, "utf8").trim().length).toBe(43); // 32 random bytes, base64url
  });

  it("prefers the secret from the environment", () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), "stillspan-config-"));
    expect(new TextDecoder().decode(loadSessionSecret(dir, "s".repeat(32)))).toBe("s".repeat(32));
  });
});
