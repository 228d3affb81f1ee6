import type { Request } from "express";
import type { Config } from "./config.js";
import type { Db } from "./db/client.js";
import type { Logger } from "./logger.js";
import type { SweepPool } from "./services/sweep-pool.js";

/** What route factories, middleware and services receive: the database, the configuration, the logger, the sweep pool. */
export interface AppContext {
  db: Db;
  config: Config;
  logger: Logger;
  /** The app's sweep worker pool (created with the app, closed by `closeApp`). */
  sweeps: SweepPool;
}

export const APP_CONTEXT_KEY = "stillspan";

/** The context of the app serving this request (stored in app.locals by createApp). */
export function appContext(req: Request): AppContext {
  return req.app.locals[APP_CONTEXT_KEY] as AppContext;
}
