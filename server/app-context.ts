import type { Request } from "express";
import type { Config } from "./config.js";
import type { Db } from "./db/client.js";
import type { Logger } from "./logger.js";

/** What route factories, middleware and services receive: the database, the configuration, the logger. */
export interface AppContext {
  db: Db;
  config: Config;
  logger: Logger;
}

export const APP_CONTEXT_KEY = "stillspan";

/** The context of the app serving this request (stored in app.locals by createApp). */
export function appContext(req: Request): AppContext {
  return req.app.locals[APP_CONTEXT_KEY] as AppContext;
}
