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
