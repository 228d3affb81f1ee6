/**
 * Two checkouts side by side, each with PostgreSQL in its own data folder (STILLSPAN_DATA_DIR), driven through
 * the real commands: `tsx server/main.ts` (what `npm start` runs after the build) and `tsx server/db/pg-cli.ts`
 * (`npm run db:start` / `db:stop`). The PostgreSQL `npm start` started stops when it stops, unless db:start
 * started it; a port held by another cluster or program gives a free port (PGPORT unset) or one sentence saying
 * what to do (PGPORT set) — never a stack trace.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { chmodSync, existsSync, mkdtempSync, rmSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { projectRoot } from "../../server/config.js";
import { ensureLocalPostgres, portIsFree, releaseLocalPostgres, stopLocalPostgres } from "../../server/db/pg-local.js";
import { logger } from "../../server/logger.js";

const quiet = logger.child({}, { level: "silent" });
const tsx = path.join(projectRoot, "node_modules", ".bin", "tsx");
const checkouts: string[] = [];

/** A fresh data folder standing for another checkout (traversable, so the cluster stays inside it). */
function newCheckout(): string {
  const dir = mkdtempSync(path.join(os.tmpdir(), "stillspan-checkout-"));
  chmodSync(dir, 0o755);
  checkouts.push(dir);
  return dir;
}

afterAll(async () => {
  for (const dir of checkouts) {
    await stopLocalPostgres({ projectRoot, port: 0, dataDir: dir, logger: quiet }).catch(() => undefined);
    rmSync(dir, { recursive: true, force: true });
  }
});

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

/** Holds a port the way any other program would. */
async function holdPort(): Promise<{ port: number; release: () => Promise<void> }> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as net.AddressInfo;
  return { port, release: () => new Promise((resolve) => server.close(() => resolve())) };
}

/** The environment of a checkout: its own data folder, ports and secrets; nothing from the test run's database. */
async function checkoutEnv(dataDir: string, extra: Record<string, string | undefined>): Promise<NodeJS.ProcessEnv> {
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    STILLSPAN_DATA_DIR: dataDir,
    STILLSPAN_SEED: "none",
    STILLSPAN_CLIENT_DIR: "/nonexistent",
    STILLSPAN_SESSION_SECRET: "c".repeat(32),
    PORT: String(await freePort()),
    SMTP_PORT: String(await freePort()),
    LOG_LEVEL: "warn",
    ...extra,
  };
  for (const name of ["DATABASE_URL", "DATABASE_OWNER_URL", "SMTP_HOST", "PGPORT"]) if (extra[name] === undefined) delete env[name];
  return env;
}

interface Finished {
  code: number | null;
  stdout: string;
  stderr: string;
}

function start(script: string, args: string[], env: NodeJS.ProcessEnv) {
  const child = spawn(tsx, [script, ...args], { cwd: projectRoot, env, detached: true, stdio: ["ignore", "pipe", "pipe"] });
  const out = { stdout: "", stderr: "" };
  child.stdout!.on("data", (d: Buffer) => (out.stdout += d.toString()));
  child.stderr!.on("data", (d: Buffer) => (out.stderr += d.toString()));
  const finished = new Promise<Finished>((resolve) => child.on("exit", (code) => resolve({ code, ...out })));
  return { child, out, finished };
}

const run = (script: string, args: string[], env: NodeJS.ProcessEnv) => start(script, args, env).finished;

/** Starts the app like `npm start` and waits until it listens. */
async function startApp(env: NodeJS.ProcessEnv) {
  const app = start("server/main.ts", [], env);
  const deadline = Date.now() + 60_000;
  while (!app.out.stdout.includes("Stillspan runs at")) {
    if (app.child.exitCode !== null || Date.now() > deadline) {
      throw new Error(`the app did not start (exit ${app.child.exitCode}):\n${app.out.stdout}\n${app.out.stderr}`);
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  return app;
}

/** Ctrl-C in the terminal: SIGINT to the whole process group. */
async function interrupt(app: { child: ChildProcess; finished: Promise<Finished> }): Promise<Finished> {
  process.kill(-app.child.pid!, "SIGINT");
  return app.finished;
}

async function until(check: () => Promise<boolean>, timeoutMs = 15_000): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await check()) return true;
    await new Promise((r) => setTimeout(r, 200));
  }
  return check();
}

const pidFile = (dataDir: string) => path.join(dataDir, "postgres", "cluster", "postmaster.pid");

/** What a person sees when a command refuses to start: one sentence on stderr, no stack trace anywhere. */
function expectOneSentence(result: Finished, pattern: RegExp): void {
  expect(result.code, result.stderr).toBe(1);
  const lines = result.stderr.trim().split("\n");
  expect(lines, "stderr is one line").toHaveLength(1);
  expect(lines[0]).toMatch(pattern);
  expect(`${result.stdout}\n${result.stderr}`, "no stack trace").not.toMatch(/\n\s+at \S|"stack"/);
}

describe("PostgreSQL's life cycle with npm start", () => {
  it("stops the PostgreSQL npm start started when it stops; keeps one that npm run db:start started", async () => {
    const dataDir = newCheckout();
    const pgPort = await freePort();
    const env = await checkoutEnv(dataDir, { PGPORT: String(pgPort) });

    const first = await startApp(env);
    expect(await portIsFree(pgPort), "PostgreSQL listens while the app runs").toBe(false);
    expect((await interrupt(first)).code).toBe(0);
    expect(await until(() => portIsFree(pgPort)), "PostgreSQL stopped with the app").toBe(true);
    expect(existsSync(pidFile(dataDir))).toBe(false);

    const dbStart = await run("server/db/pg-cli.ts", ["start"], env);
    expect(dbStart.code, dbStart.stderr).toBe(0);
    expect(dbStart.stdout).toMatch(/keeps running until npm run db:stop/);
    const second = await startApp(env);
    expect((await interrupt(second)).code).toBe(0);
    await new Promise((r) => setTimeout(r, 1000));
    expect(await portIsFree(pgPort), "PostgreSQL started by db:start still runs after the app stopped").toBe(false);
    expect(existsSync(pidFile(dataDir))).toBe(true);

    expect((await run("server/db/pg-cli.ts", ["stop"], env)).code).toBe(0);
    expect(await until(() => portIsFree(pgPort))).toBe(true);
  }, 180_000);
});

describe("a second checkout beside the first", () => {
  it("with the first one's cluster on the port: one sentence when PGPORT names that port, a free port when PGPORT is unset", async () => {
    const first = newCheckout();
    const second = newCheckout();
    const port = await freePort();
    const firstEnv = await checkoutEnv(first, { PGPORT: String(port) });
    expect((await run("server/db/pg-cli.ts", ["start"], firstEnv)).code).toBe(0);

    const secondEnv = await checkoutEnv(second, { PGPORT: String(port) });
    expectOneSentence(await run("server/db/pg-cli.ts", ["start"], secondEnv), new RegExp(`^Port ${port} on 127\\.0\\.0\\.1 is in use .*PGPORT=`));
    expectOneSentence(await run("server/main.ts", [], secondEnv), new RegExp(`^Stillspan did not start: Port ${port} on 127\\.0\\.0\\.1 is in use .*PGPORT=`));

    // PGPORT unset: the second checkout's cluster takes another port, and both run.
    const cluster = await ensureLocalPostgres({ projectRoot, port, portIsDefault: true, dataDir: second, logger: quiet });
    expect(cluster.port).not.toBe(port);
    expect(cluster.started).toBe(true);
    expect(await portIsFree(cluster.port)).toBe(false);
    expect(await portIsFree(port)).toBe(false);
    expect(await releaseLocalPostgres(cluster, quiet)).toBe("stopped");
    expect(await until(() => portIsFree(cluster.port))).toBe(true);
    expect((await run("server/db/pg-cli.ts", ["stop"], firstEnv)).code).toBe(0);
  }, 180_000);

  it("with any other program on PostgreSQL's or the app's port: one sentence, and the PostgreSQL it started is stopped again", async () => {
    const dataDir = newCheckout();
    const held = await holdPort();
    try {
      const pgHeld = await checkoutEnv(dataDir, { PGPORT: String(held.port) });
      expectOneSentence(await run("server/main.ts", [], pgHeld), /^Stillspan did not start: Port \d+ on 127\.0\.0\.1 is in use .*PGPORT=/);

      const pgPort = await freePort();
      const httpHeld = await checkoutEnv(dataDir, { PGPORT: String(pgPort), PORT: String(held.port) });
      expectOneSentence(await run("server/main.ts", [], httpHeld), new RegExp(`^Stillspan did not start: Port ${held.port} on 127\\.0\\.0\\.1 is in use .*PORT=`));
      expect(await until(() => portIsFree(pgPort)), "PostgreSQL started for the failed start is stopped").toBe(true);
    } finally {
      await held.release();
    }
  }, 180_000);
});
