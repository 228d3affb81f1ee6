/** An app built in-process with createApp, listening on a free port, for tests that need their own settings. */
import type { AddressInfo } from "node:net";
import type { Express } from "express";
import { closeApp, createApp } from "../../server/app.js";
import { loadConfig, type Config } from "../../server/config.js";
import { createDb, type Db } from "../../server/db/client.js";
import { createHttpServer } from "../../server/http-server.js";
import { logger, type Logger } from "../../server/logger.js";
import { testEnv } from "./env.js";

export interface TestApp {
  baseUrl: string;
  app: Express;
  db: Db;
  config: Config;
  close(): Promise<void>;
}

export interface StartTestAppOptions {
  /** Database URL (default: the test database, as the app's role). */
  databaseUrl?: string;
  /** Environment overrides on top of the test environment (e.g. { TRUST_PROXY: "1" }). */
  env?: Record<string, string>;
  /** The app's logger (default: silent), e.g. one from createLogger writing to a stream the test measures. */
  logger?: Logger;
}

export async function startTestApp(options: StartTestAppOptions = {}): Promise<TestApp> {
  const config = loadConfig({
    ...process.env,
    STILLSPAN_SESSION_SECRET: new TextDecoder().decode(testEnv.sessionSecret),
    STILLSPAN_SEED: "none",
    ...options.env,
  });
  const db = createDb(options.databaseUrl ?? testEnv.appDatabaseUrl, { max: 3, connectionTimeoutMillis: 2000 });
  const app = createApp({ db, config, logger: options.logger ?? logger.child({}, { level: "silent" }), clientDir: "/nonexistent" });
  const server = createHttpServer(app, config).listen(0, "127.0.0.1");
  await new Promise<void>((resolve, reject) => {
    server.once("listening", resolve);
    server.once("error", reject);
  });
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    app,
    db,
    config,
    async close() {
      await closeApp(app);
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await db.$client.end();
    },
  };
}
