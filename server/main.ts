/**
 * Production entry (`npm start`): config → PostgreSQL (our own cluster unless DATABASE_URL) → migrations →
 * demo seed on an empty database (unless STILLSPAN_SEED=none) → HTTP on STILLSPAN_HOST:PORT (127.0.0.1:3000).
 */
import type { Server } from "node:http";
import { closeApp, createApp } from "./app.js";
import { ConfigError, loadConfig, projectRoot, type Config } from "./config.js";
import { createDb, type Db } from "./db/client.js";
import { createHttpServer } from "./http-server.js";
import { runMigrations } from "./db/migrate.js";
import { createDatabase, ensureLocalPostgres } from "./db/pg-local.js";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "./db/seed/accounts.js";
import { prepareDatabaseContent } from "./db/seed.js";
import { logger } from "./logger.js";
import { startFakeSmtpIfNeeded } from "./services/mail.js";
import { ensureSigningKey } from "./services/signing.js";

async function resolveDatabaseUrl(config: Config): Promise<string> {
  if (config.databaseUrl) return config.databaseUrl;
  const cluster = await ensureLocalPostgres({ projectRoot, port: config.pgPort, logger });
  await createDatabase(cluster.url, config.databaseName);
  return cluster.urlFor(config.databaseName);
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

  const db: Db = createDb(await resolveDatabaseUrl(config));
  await runMigrations(db);
  // The signing key exists before the seed runs (the demo seed signs a summary).
  const signingKey = await ensureSigningKey(config);
  logger.info(signingKey, "summary signing key ready");
  const fakeSmtp = await startFakeSmtpIfNeeded(config, db, logger);
  const seeded = await prepareDatabaseContent(db, config, logger);

  const app = createApp({ db, config, logger, clientDir: config.clientDir });
  const server: Server = createHttpServer(app, config).listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => {
    server.once("listening", resolve);
    server.once("error", reject);
  });
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

  const shutdown = (signal: string) => {
    logger.info({ signal }, "shutting down");
    const closeMail = fakeSmtp ? fakeSmtp.close() : Promise.resolve();
    // Sweeps still running or waiting end with 503 (their workers stop), so the connections can close.
    const closeSweeps = closeApp(app);
    server.close(() => void Promise.all([closeMail, closeSweeps]).then(() => db.$client.end()).finally(() => process.exit(0)));
    server.closeAllConnections();
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.once("SIGINT", () => shutdown("SIGINT"));
  process.once("SIGTERM", () => shutdown("SIGTERM"));
}

// Process-level failures end up in the same log, then stop the process: its state is unknown.
process.on("unhandledRejection", (err) => {
  logger.fatal({ err }, "unhandled promise rejection");
  process.exit(1);
});
process.on("uncaughtException", (err) => {
  logger.fatal({ err }, "uncaught exception");
  process.exit(1);
});

main().catch((err: unknown) => {
  logger.fatal({ err }, "Stillspan failed to start");
  console.error(`Stillspan failed to start: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
