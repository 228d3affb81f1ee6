/**
 * Production entry (`npm start`): config → PostgreSQL (our own cluster unless DATABASE_URL) → migrations as the
 * owner role → demo seed on an empty database (unless STILLSPAN_SEED=none) → HTTP on STILLSPAN_HOST:PORT
 * (127.0.0.1:3000), connected as the app role. Our own cluster, when this process started it, stops when it ends
 * (unless `npm run db:start` started it, or other sessions use it).
 */
import type { Server } from "node:http";
import { closeApp, createApp } from "./app.js";
import { ConfigError, loadConfig, projectRoot, type Config } from "./config.js";
import { createDb, type Db } from "./db/client.js";
import { createHttpServer } from "./http-server.js";
import { migrateAsOwner } from "./db/migrate.js";
import { createDatabase, ensureLocalPostgres, releaseLocalPostgres, type LocalPostgres } from "./db/pg-local.js";
import { OWNER_ROLE } from "./db/pg-roles.js";
import { StartupError } from "./errors.js";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "./db/seed/accounts.js";
import { prepareDatabaseContent } from "./db/seed.js";
import { logger } from "./logger.js";
import { startFakeSmtpIfNeeded } from "./services/mail.js";
import { ensureSigningKey } from "./services/signing.js";

/** The project's own cluster when this process started it: stopped again when the process ends. */
let localCluster: LocalPostgres | undefined;
/** The app's connection pool, closed before the cluster is released (its sessions would count as users). */
let appDb: Db | undefined;

async function releaseCluster(): Promise<void> {
  const [cluster, db] = [localCluster, appDb];
  localCluster = undefined;
  appDb = undefined;
  await db?.$client.end().catch(() => undefined);
  if (cluster) await releaseLocalPostgres(cluster, logger).catch((err: unknown) => logger.error({ err }, "PostgreSQL could not be stopped"));
}

/** Where the app and its migrations connect: DATABASE_URL (and DATABASE_OWNER_URL), or our own cluster's two roles. */
async function resolveDatabase(config: Config): Promise<{ appUrl: string; ownerUrl: string }> {
  if (config.databaseUrl) return { appUrl: config.databaseUrl, ownerUrl: config.databaseOwnerUrl ?? config.databaseUrl };
  const cluster = await ensureLocalPostgres({
    projectRoot,
    port: config.pgPort,
    portIsDefault: !config.pgPortExplicit,
    dataDir: config.dataDir,
    logger,
  });
  localCluster = cluster;
  await createDatabase(cluster.url, config.databaseName, OWNER_ROLE);
  return { appUrl: cluster.appUrlFor(config.databaseName), ownerUrl: cluster.ownerUrlFor(config.databaseName) };
}

/** The HTTP server, listening; a taken port is one sentence, not a stack trace. */
async function listen(app: ReturnType<typeof createApp>, config: Config): Promise<Server> {
  const server: Server = createHttpServer(app, config).listen(config.port, config.host);
  try {
    await new Promise<void>((resolve, reject) => {
      server.once("listening", resolve);
      server.once("error", reject);
    });
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === "EADDRINUSE") {
      throw new StartupError(
        `Port ${config.port} on ${config.host} is in use (perhaps by another checkout's Stillspan): stop that one, or start this one on a free port, e.g. PORT=${config.port + 1} npm start.`,
      );
    }
    throw err;
  }
  return server;
}

async function main(): Promise<void> {
  let config: Config;
  try {
    config = loadConfig();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(2);
    }
    throw err;
  }

  const { appUrl, ownerUrl } = await resolveDatabase(config);
  const db: Db = createDb(appUrl);
  appDb = db;
  await migrateAsOwner(ownerUrl, db, logger);
  // The signing key exists before the seed runs (the demo seed signs a summary).
  const signingKey = await ensureSigningKey(config);
  logger.info(signingKey, "summary signing key ready");
  const fakeSmtp = await startFakeSmtpIfNeeded(config, db, logger);
  const seeded = await prepareDatabaseContent(db, config, logger);

  const app = createApp({ db, config, logger, clientDir: config.clientDir });
  const server = await listen(app, config);
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : config.port;
  const url = `http://${config.host}:${port}`;
  logger.info({ url }, "Stillspan is listening");
  console.log(`\nStillspan runs at ${url}`);
  if (seeded === "demo" || config.seed === "demo") {
    console.log(`Demo accounts (password "${DEMO_PASSWORD}"; demo data is invented):`);
    for (const a of DEMO_ACCOUNTS) console.log(`  ${a.email.padEnd(26)} ${a.label}`);
  }
  if (fakeSmtp) {
    console.log(
      `Mail goes to the local fake SMTP server on ${fakeSmtp.host}:${fakeSmtp.port} (nothing leaves this machine); ` +
        "administrators read it on the Mailbox page (/admin/mailbox).",
    );
  }
  console.log("");

  onSignal = (signal) => {
    logger.info({ signal }, "shutting down");
    const closeMail = fakeSmtp ? fakeSmtp.close() : Promise.resolve();
    // Sweeps still running or waiting end with 503 (their workers stop), so the connections can close.
    const closeSweeps = closeApp(app);
    server.close(
      () =>
        void Promise.all([closeMail, closeSweeps])
          .then(releaseCluster)
          .finally(() => process.exit(0)),
    );
    server.closeAllConnections();
    setTimeout(() => process.exit(0), 15_000).unref();
  };
}

/** Ends the process after a failure, stopping the cluster this process started (within 10 s). */
function fail(code: number): void {
  setTimeout(() => process.exit(code), 10_000).unref();
  void releaseCluster().finally(() => process.exit(code));
}

// Ctrl-C reaches this process twice (from the terminal, and relayed by tsx): the first signal starts the
// shutdown, later ones are ignored so the cluster is still released. A signal during start-up ends the start.
let onSignal: (signal: string) => void = () => fail(130);
let signalled = false;
for (const signal of ["SIGINT", "SIGTERM"] as const) {
  process.on(signal, () => {
    if (signalled) return;
    signalled = true;
    onSignal(signal);
  });
}

// Process-level failures end up in the same log, then stop the process: its state is unknown.
process.on("unhandledRejection", (err) => {
  logger.fatal({ err }, "unhandled promise rejection");
  fail(1);
});
process.on("uncaughtException", (err) => {
  logger.fatal({ err }, "uncaught exception");
  fail(1);
});

main().catch((err: unknown) => {
  if (err instanceof StartupError) {
    // Something the person starting it can fix: the sentence says what, and nothing else is printed.
    console.error(`Stillspan did not start: ${err.message}`);
  } else {
    logger.fatal({ err }, "Stillspan failed to start");
    console.error(`Stillspan failed to start: ${err instanceof Error ? err.message : String(err)}`);
  }
  fail(1);
});
