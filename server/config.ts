import { randomBytes } from "node:crypto";
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { z } from "zod";
import type { SweepPoolSettings } from "./services/sweep-pool.js";

/** Absolute path of the project root (the folder holding package.json). */
export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

const port = (fallback: number) => z.coerce.number().int().min(0).max(65535).default(fallback);
const optionalText = z.string().trim().min(1).optional();
/** A whole number ≥ min (milliseconds, counts); unset or empty means the default (or undefined without one). */
const wholeNumber = (min: number) =>
  z.number({ error: "must be a whole number" }).int("must be a whole number").min(min, `must be at least ${min}`);
const unsetIfEmpty = (v: unknown) => (v === undefined || (typeof v === "string" && v.trim() === "") ? undefined : Number(v));
const count = (min: number, fallback: number) => z.preprocess(unsetIfEmpty, wholeNumber(min).default(fallback));
const optionalCount = (min: number) => z.preprocess(unsetIfEmpty, wholeNumber(min).optional());
const flag = z
  .enum(["0", "1", "true", "false", ""])
  .optional()
  .transform((v) => v === "1" || v === "true");

/**
 * The site's address as users reach it: an http(s) origin, optionally with a trailing slash, nothing else — the app
 * is served from the root of its host, and links and the same-origin check are built from this origin.
 */
const publicUrlSchema = z.url({ protocol: /^https?$/, error: "must be an http:// or https:// address" }).superRefine((value, ctx) => {
  if (!URL.canParse(value)) return; // reported by z.url
  const url = new URL(value);
  if (url.username || url.password) ctx.addIssue({ code: "custom", message: "must not carry a user name or password" });
  if (url.pathname !== "/" || url.search || url.hash) {
    ctx.addIssue({ code: "custom", message: `must be an origin such as https://stillspan.example.org, without a path, query or fragment (got ${value})` });
  }
});

/** Every environment variable the server reads, validated once at start. */
const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  STILLSPAN_HOST: z.string().min(1).default("127.0.0.1"),
  PORT: port(3000),
  PGPORT: port(54329),
  DATABASE_URL: z.url({ protocol: /^postgres(ql)?$/ }).optional(),
  DATABASE_OWNER_URL: z.url({ protocol: /^postgres(ql)?$/ }).optional(),
  STILLSPAN_DB_NAME: z.string().regex(/^[a-z_][a-z0-9_]*$/, "lower-case letters, digits and _ only").default("stillspan"),
  STILLSPAN_DATA_DIR: optionalText,
  STILLSPAN_CLIENT_DIR: optionalText,
  STILLSPAN_SEED: z.enum(["demo", "none"]).default("demo"),
  STILLSPAN_SESSION_SECRET: z.string().min(32, "at least 32 characters").optional(),
  STILLSPAN_ADMIN_EMAIL: z.email().optional(),
  STILLSPAN_ADMIN_PASSWORD: z.string().min(12, "at least 12 characters").optional(),
  STILLSPAN_SIGNIN_LIMIT: z.coerce.number().int().positive().default(10),
  STILLSPAN_SIGNIN_WINDOW_MS: z.coerce.number().int().positive().default(15 * 60 * 1000),
  TRUST_PROXY: flag,
  SMTP_HOST: optionalText,
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).optional(),
  SMTP_USER: optionalText,
  SMTP_PASSWORD: optionalText,
  SMTP_FROM: z.email().optional(),
  SMTP_SECURE: flag,
  STILLSPAN_KEYS_DIR: optionalText,
  STILLSPAN_SIGNING_KEY: optionalText,
  STILLSPAN_SIGNING_RETIRED_JWKS: optionalText,
  STILLSPAN_PUBLIC_URL: publicUrlSchema.optional(),
  STILLSPAN_SWEEP_WORKERS: count(1, 2),
  STILLSPAN_SWEEP_TIMEOUT_MS: count(1, 20_000),
  STILLSPAN_SWEEP_QUEUE: count(0, 8),
  STILLSPAN_SWEEP_QUEUE_PER_USER: count(1, 3),
  STILLSPAN_SWEEP_MAX_WAIT_MS: count(1, 30_000),
  STILLSPAN_SWEEP_MAX_SOLVED_STEPS: count(2, 30_000),
  STILLSPAN_REQUEST_TIMEOUT_MS: count(1, 60_000),
  STILLSPAN_HEADERS_TIMEOUT_MS: optionalCount(1),
});

export type Env = z.infer<typeof envSchema>;

export interface Config {
  nodeEnv: Env["NODE_ENV"];
  host: string;
  port: number;
  pgPort: number;
  /** True when PGPORT was set: a busy port is then reported, not replaced by a free one. */
  pgPortExplicit: boolean;
  /** The app's connection (DATABASE_URL): a role that may read and write rows, not change the schema. */
  databaseUrl?: string;
  /** The owner role's connection for migrations (DATABASE_OWNER_URL; default: DATABASE_URL). */
  databaseOwnerUrl?: string;
  databaseName: string;
  dataDir: string;
  /** Built client served by Express (default dist/client). */
  clientDir: string;
  seed: Env["STILLSPAN_SEED"];
  sessionSecret: Uint8Array;
  admin?: { email: string; password: string };
  signInRateLimit: { limit: number; windowMs: number };
  trustProxy: boolean;
  /** Outgoing mail; without `host` the server runs the local fake SMTP server on 127.0.0.1:`port` (default 2525). */
  smtp: { host?: string; port?: number; secure: boolean; user?: string; password?: string; from?: string };
  /** Summary signing keys: a key folder (default <dataDir>/keys), or a private key given by the environment. */
  signing: { keysDir: string; privateKey?: string; retiredJwks?: string };
  /**
   * Origin of the site as users reach it (STILLSPAN_PUBLIC_URL; default http://host:port), no trailing slash: for
   * absolute links (e-mails) and, beside the request's own Host, as the app's origin in the same-origin check.
   */
  publicUrl: string;
  /** The sweep worker pool (STILLSPAN_SWEEP_*), see server/services/sweep-pool.ts. */
  sweeps: SweepPoolSettings;
  /** Node's limits on receiving a request: its headers, and the whole request with its body (ms). */
  http: { headersTimeoutMs: number; requestTimeoutMs: number };
}

export class ConfigError extends Error {
  constructor(readonly problems: string[]) {
    super(`Invalid configuration:\n${problems.map((p) => `  - ${p}`).join("\n")}`);
    this.name = "ConfigError";
  }
}

/** Parses the environment; throws a ConfigError listing every missing or bad variable at once. */
export function parseEnv(env: NodeJS.ProcessEnv = process.env): Env {
  const result = envSchema.safeParse(env);
  const problems = result.success ? [] : result.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
  if (result.success) {
    const e = result.data;
    if (Boolean(e.STILLSPAN_ADMIN_EMAIL) !== Boolean(e.STILLSPAN_ADMIN_PASSWORD)) {
      problems.push("STILLSPAN_ADMIN_EMAIL and STILLSPAN_ADMIN_PASSWORD: set both or neither");
    }
    if ((e.STILLSPAN_HEADERS_TIMEOUT_MS ?? 0) > e.STILLSPAN_REQUEST_TIMEOUT_MS) {
      problems.push("STILLSPAN_HEADERS_TIMEOUT_MS: must not be longer than STILLSPAN_REQUEST_TIMEOUT_MS");
    }
    if (e.DATABASE_OWNER_URL && !e.DATABASE_URL) {
      problems.push("DATABASE_OWNER_URL: set DATABASE_URL too (the app's own role); without both, the project's own PostgreSQL is used");
    }
  }
  if (problems.length > 0 || !result.success) throw new ConfigError(problems);
  return result.data;
}

/**
 * The session signing secret: STILLSPAN_SESSION_SECRET when set, otherwise a random 256-bit secret generated on
 * first start and kept in <dataDir>/session-secret (mode 0600) so sessions survive restarts.
 */
export function loadSessionSecret(dataDir: string, fromEnv?: string): Uint8Array {
  if (fromEnv) return new TextEncoder().encode(fromEnv);
  const file = path.join(dataDir, "session-secret");
  if (!existsSync(file)) {
    mkdirSync(dataDir, { recursive: true });
    writeFileSync(file, randomBytes(32).toString("base64url") + "\n", { mode: 0o600, flag: "wx" });
  }
  chmodSync(file, 0o600);
  return new TextEncoder().encode(readFileSync(file, "utf8").trim());
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const e = parseEnv(env);
  const dataDir = path.resolve(projectRoot, e.STILLSPAN_DATA_DIR ?? ".data");
  return {
    nodeEnv: e.NODE_ENV,
    host: e.STILLSPAN_HOST,
    port: e.PORT,
    pgPort: e.PGPORT,
    pgPortExplicit: env.PGPORT !== undefined && env.PGPORT !== "",
    databaseUrl: e.DATABASE_URL,
    databaseOwnerUrl: e.DATABASE_OWNER_URL,
    databaseName: e.STILLSPAN_DB_NAME,
    dataDir,
    clientDir: path.resolve(projectRoot, e.STILLSPAN_CLIENT_DIR ?? path.join("dist", "client")),
    seed: e.STILLSPAN_SEED,
    sessionSecret: loadSessionSecret(dataDir, e.STILLSPAN_SESSION_SECRET),
    admin:
      e.STILLSPAN_ADMIN_EMAIL && e.STILLSPAN_ADMIN_PASSWORD
        ? { email: e.STILLSPAN_ADMIN_EMAIL.toLowerCase(), password: e.STILLSPAN_ADMIN_PASSWORD }
        : undefined,
    signInRateLimit: { limit: e.STILLSPAN_SIGNIN_LIMIT, windowMs: e.STILLSPAN_SIGNIN_WINDOW_MS },
    trustProxy: e.TRUST_PROXY,
    smtp: {
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: e.SMTP_SECURE,
      user: e.SMTP_USER,
      password: e.SMTP_PASSWORD,
      from: e.SMTP_FROM,
    },
    signing: {
      keysDir: path.resolve(projectRoot, e.STILLSPAN_KEYS_DIR ?? path.join(dataDir, "keys")),
      privateKey: e.STILLSPAN_SIGNING_KEY,
      retiredJwks: e.STILLSPAN_SIGNING_RETIRED_JWKS,
    },
    publicUrl: (e.STILLSPAN_PUBLIC_URL ?? `http://${e.STILLSPAN_HOST}:${e.PORT}`).replace(/\/+$/, ""),
    sweeps: {
      workers: e.STILLSPAN_SWEEP_WORKERS,
      computeLimitMs: e.STILLSPAN_SWEEP_TIMEOUT_MS,
      queueLimit: e.STILLSPAN_SWEEP_QUEUE,
      queuePerUser: e.STILLSPAN_SWEEP_QUEUE_PER_USER,
      maxWaitMs: e.STILLSPAN_SWEEP_MAX_WAIT_MS,
      maxSolvedSteps: e.STILLSPAN_SWEEP_MAX_SOLVED_STEPS,
    },
    http: {
      headersTimeoutMs: e.STILLSPAN_HEADERS_TIMEOUT_MS ?? Math.min(20_000, e.STILLSPAN_REQUEST_TIMEOUT_MS),
      requestTimeoutMs: e.STILLSPAN_REQUEST_TIMEOUT_MS,
    },
  };
}
