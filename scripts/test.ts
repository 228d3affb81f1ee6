/**
 * `npm test`: everything the README's test command promises, on a database of its own.
 *
 *   0. the static checks, `npm run lint` (ESLint and knip) and `npm run typecheck` (tsc): a failure of either
 *      ends the run before anything starts (skipped when arguments name what vitest runs, a focused run)
 *   1. Debian's Chromium for the browser tests (scripts/ensure-chromium.sh)
 *   2. the project's PostgreSQL cluster (started when needed, and stopped again at the end when this run started
 *      it), a database of its own (`stillspan_test_<pid>`, dropped afterwards) created, migrated as the owner role
 *      and seeded with the demo data as the app role
 *   3. `vite build` of the client into dist/client
 *   4. the app as a child process on a free port of its own (a running `npm start` does not collide)
 *   5. `vitest run` over every project (unit, client, integration incl. browser), with TEST_BASE_URL,
 *      TEST_DATABASE_URL (the owner role, for arranging data), TEST_APP_DATABASE_URL (the app's role),
 *      TEST_SESSION_SECRET, SMTP_PORT (the app's fake SMTP server) and STILLSPAN_TEST=1; arguments after `--` go
 *      to vitest
 *
 * The app child is always stopped (its whole process group); the exit code is vitest's, or 1 when a static
 * check failed.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { createWriteStream, existsSync, mkdirSync, readFileSync, rmSync } from "node:fs";
import net from "node:net";
import path from "node:path";
import { loadConfig, projectRoot } from "../server/config.js";
import { createDb } from "../server/db/client.js";
import { migrateAsOwner } from "../server/db/migrate.js";
import { createDatabase, dropDatabase, ensureLocalPostgres, releaseLocalPostgres, type LocalPostgres } from "../server/db/pg-local.js";
import { OWNER_ROLE } from "../server/db/pg-roles.js";
import { seedDemo } from "../server/db/seed.js";
import { logger } from "../server/logger.js";
import { ensureSigningKey } from "../server/services/signing.js";
import { stopProcessGroup } from "./lib/stop-process-group.js";

// One database per run (dropped afterwards), so two runs on one machine never reset each other's data.
const TEST_DB = process.env.STILLSPAN_TEST_DB ?? `stillspan_test_${process.pid}`;
const bin = (name: string) => path.join(projectRoot, "node_modules", ".bin", name);
const artifacts = path.join(projectRoot, "test-artifacts");
const started = Date.now();
const step = (what: string) => console.log(`[test] ${((Date.now() - started) / 1000).toFixed(1)}s ${what}`);

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): void {
  const result = spawnSync(cmd, args, { cwd: projectRoot, stdio: "inherit", env });
  if (result.status !== 0) throw new Error(`${cmd} ${args.join(" ")} failed (exit ${result.status ?? result.signal})`);
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.unref();
    server.on("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

async function waitForHealth(baseUrl: string, child: ChildProcess, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the app exited with code ${child.exitCode} before it was healthy`);
    try {
      const res = await fetch(`${baseUrl}/api/health`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`the app did not answer ${baseUrl}/api/health within ${timeoutMs / 1000} s`);
}

interface TestDatabase {
  /** The app role's URL of the test database. */
  appUrl: string;
  /** The owner role's URL of the test database (migrations; tests arrange data with it). */
  ownerUrl: string;
  /** Where the test database is created and dropped. */
  maintenanceUrl: string;
  /** Our own cluster, when it is used. */
  cluster?: LocalPostgres;
}

const withDatabase = (url: string, name: string) => {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
};

async function prepareDatabase(): Promise<TestDatabase> {
  const config = loadConfig({ ...process.env, DATABASE_URL: undefined, DATABASE_OWNER_URL: undefined });
  let target: TestDatabase;
  if (process.env.DATABASE_URL) {
    // An external server: the same roles, on a database of our own (the owner role needs CREATEDB).
    const ownerBase = process.env.DATABASE_OWNER_URL ?? process.env.DATABASE_URL;
    target = {
      appUrl: withDatabase(process.env.DATABASE_URL, TEST_DB),
      ownerUrl: withDatabase(ownerBase, TEST_DB),
      maintenanceUrl: withDatabase(ownerBase, "postgres"),
    };
    await dropDatabase(target.maintenanceUrl, TEST_DB);
    await createDatabase(target.maintenanceUrl, TEST_DB);
  } else {
    const cluster = await ensureLocalPostgres({
      projectRoot,
      port: config.pgPort,
      portIsDefault: !config.pgPortExplicit,
      dataDir: config.dataDir,
      logger,
    });
    target = { appUrl: cluster.appUrlFor(TEST_DB), ownerUrl: cluster.ownerUrlFor(TEST_DB), maintenanceUrl: cluster.url, cluster };
    await dropDatabase(target.maintenanceUrl, TEST_DB);
    await createDatabase(target.maintenanceUrl, TEST_DB, OWNER_ROLE);
  }
  const db = createDb(target.appUrl, { max: 2 });
  try {
    await migrateAsOwner(target.ownerUrl, db, logger);
    await ensureSigningKey(config); // the demo seed signs a summary
    await seedDemo(db, config, logger);
  } finally {
    await db.$client.end();
  }
  return target;
}

/** `npm run lint` and `npm run typecheck`, both even when the first fails (one run shows every problem). */
function staticChecks(): boolean {
  let ok = true;
  for (const script of ["lint", "typecheck"]) {
    step(`npm run ${script}`);
    const result = spawnSync("npm", ["run", "--silent", script], { cwd: projectRoot, stdio: "inherit" });
    if (result.status !== 0) {
      console.error(`[test] npm run ${script} failed (exit ${result.status ?? result.signal})`);
      ok = false;
    }
  }
  return ok;
}

async function main(): Promise<number> {
  const vitestArgs = process.argv.slice(2).filter((a, i) => !(i === 0 && a === "--"));
  mkdirSync(artifacts, { recursive: true });

  if (vitestArgs.length === 0) {
    if (!staticChecks()) return 1;
  } else {
    step("focused run: skipping lint and typecheck (a full `npm test` runs them)");
  }

  step("checking Chromium");
  run("bash", [path.join(projectRoot, "scripts", "ensure-chromium.sh")]);

  step(`preparing database ${TEST_DB}`);
  const database = await prepareDatabase();

  // Each run builds into a folder of its own, so a running `npm start` or another run keeps its files.
  const clientDir = path.join(projectRoot, "dist", `test-client-${process.pid}`);
  if (existsSync(path.join(projectRoot, "index.html"))) {
    step("building the client");
    run(bin("vite"), ["build", "--logLevel", "warn", "--outDir", clientDir]);
  } else {
    step("no index.html yet: skipping the client build");
  }

  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  // The app runs the local fake SMTP server on a free port of its own; tests never use a real SMTP server.
  const smtpPort = await freePort();
  const mailEnv = { SMTP_HOST: undefined, SMTP_USER: undefined, SMTP_PASSWORD: undefined, SMTP_PORT: String(smtpPort) };
  const sessionSecret = randomBytes(32).toString("base64url");
  const appLog = path.join(artifacts, "app.log");
  const appEnv: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "test",
    PORT: String(port),
    DATABASE_URL: database.appUrl,
    DATABASE_OWNER_URL: database.ownerUrl,
    STILLSPAN_SEED: "none",
    STILLSPAN_SESSION_SECRET: sessionSecret,
    STILLSPAN_SIGNIN_LIMIT: "100000",
    STILLSPAN_TEST: "1",
    STILLSPAN_CLIENT_DIR: clientDir,
    ...mailEnv,
    LOG_LEVEL: process.env.LOG_LEVEL ?? "warn",
  };
  step(`starting the app on ${baseUrl} (log: ${path.relative(projectRoot, appLog)})`);
  const out = createWriteStream(appLog);
  const app = spawn(bin("tsx"), ["server/main.ts"], { cwd: projectRoot, env: appEnv, detached: true, stdio: ["ignore", "pipe", "pipe"] });
  app.stdout!.pipe(out);
  app.stderr!.pipe(out);

  const stop = () => void stopProcessGroup(app).then(() => process.exit(130));
  process.once("SIGINT", stop);
  process.once("SIGTERM", stop);
  try {
    try {
      await waitForHealth(baseUrl, app, 60_000);
    } catch (err) {
      console.error(readFileSync(appLog, "utf8").split("\n").slice(-30).join("\n"));
      throw err;
    }
    step("running vitest");
    const vitest = spawnSync(bin("vitest"), ["run", ...vitestArgs], {
      cwd: projectRoot,
      stdio: "inherit",
      env: {
        ...process.env,
        TEST_BASE_URL: baseUrl,
        TEST_DATABASE_URL: database.ownerUrl,
        TEST_APP_DATABASE_URL: database.appUrl,
        TEST_SESSION_SECRET: sessionSecret,
        STILLSPAN_TEST: "1",
        ...mailEnv,
      },
    });
    step(`vitest finished (exit ${vitest.status ?? vitest.signal})`);
    return vitest.status ?? 1;
  } finally {
    await stopProcessGroup(app);
    rmSync(clientDir, { recursive: true, force: true });
    if (!process.env.STILLSPAN_TEST_DB) await dropDatabase(database.maintenanceUrl, TEST_DB).catch(() => undefined);
    if (database.cluster) await releaseLocalPostgres(database.cluster, logger).catch(() => undefined);
  }
}

main()
  .then((code) => process.exit(code))
  .catch((err: unknown) => {
    console.error(`[test] ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
