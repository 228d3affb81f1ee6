import { existsSync } from "node:fs";
import path from "node:path";
import compression from "compression";
import cookieParser from "cookie-parser";
import express, { type Express } from "express";
import helmet from "helmet";
import { APP_CONTEXT_KEY, type AppContext } from "./app-context.js";
import type { Config } from "./config.js";
import { projectRoot } from "./config.js";
import type { Db } from "./db/client.js";
import { AppError } from "./errors.js";
import { refuseInvalidUtf8Body } from "./lib/strict-utf8.js";
import { logger as defaultLogger, type Logger } from "./logger.js";
import { apiNotFound, errorHandler } from "./middleware/error-handler.js";
import { sameOriginGuard } from "./middleware/same-origin.js";
import { apiRouter } from "./routes/index.js";
import { wellKnownRoutes } from "./routes/well-known.js";
import { SweepPool } from "./services/sweep-pool.js";

export interface CreateAppOptions {
  db: Db;
  config: Config;
  logger?: Logger;
  /** Built client to serve (default dist/client); skipped when the folder does not exist. */
  clientDir?: string;
}

/**
 * Builds the Express app: security headers, compressed answers, JSON API under /api, the built client with its
 * SPA fallback. The app owns a sweep worker pool made from `config.sweeps`; `closeApp` closes it.
 */
export function createApp(options: CreateAppOptions): Express {
  const ctx: AppContext = {
    db: options.db,
    config: options.config,
    logger: options.logger ?? defaultLogger,
    sweeps: new SweepPool(options.config.sweeps),
  };
  const app = express();
  app.locals[APP_CONTEXT_KEY] = ctx;
  app.disable("x-powered-by");
  if (ctx.config.trustProxy) app.set("trust proxy", 1);

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // Plotly injects inline styles; scripts stay same-origin only.
          "style-src": ["'self'", "'unsafe-inline'"],
          "img-src": ["'self'", "data:", "blob:"],
          "upgrade-insecure-requests": null,
        },
      },
      // Served over plain HTTP on loopback by default: HSTS only makes sense behind an HTTPS proxy.
      strictTransportSecurity: ctx.config.trustProxy,
    }),
  );
  // Before any body is read: a write from another site is refused without parsing it.
  app.use("/api", sameOriginGuard(ctx.config));
  // gzip or brotli for every compressible answer over 1 kB (zlib works in the thread pool, off the event loop).
  app.use(compression());
  app.use(express.json({ limit: "1mb", verify: refuseInvalidUtf8Body }));
  app.use(cookieParser());

  app.use("/api", apiRouter(ctx), apiNotFound);
  app.use("/.well-known", wellKnownRoutes(ctx));

  const clientDir = options.clientDir ?? path.join(projectRoot, "dist", "client");
  if (existsSync(path.join(clientDir, "index.html"))) {
    // Vite names built assets by content hash: they never change, so browsers may keep them.
    app.use("/assets", express.static(path.join(clientDir, "assets"), { index: false, immutable: true, maxAge: "365d" }));
    app.use("/assets", (_req, _res, next) => next(AppError.notFound("Asset")));
    app.use(express.static(clientDir, { index: false, maxAge: "1h" }));
    app.get("/{*splat}", (_req, res) => {
      res.setHeader("Cache-Control", "no-cache");
      res.sendFile(path.join(clientDir, "index.html"));
    });
  }

  app.use((req, _res, next) => next(new AppError(404, "not_found", `Nothing at ${req.method} ${req.path}.`)));
  app.use(errorHandler(ctx.logger));
  return app;
}

/** Releases what the app owns (its sweep pool: waiting and running sweeps fail with 503, workers end). */
export async function closeApp(app: Express): Promise<void> {
  await (app.locals[APP_CONTEXT_KEY] as AppContext).sweeps.close();
}
