import { createServer, type Server } from "node:http";
import type { Express } from "express";
import type { Config } from "./config.js";

/**
 * The HTTP server for the app, with Node's request limits set on purpose: a client must send its headers
 * within `headersTimeoutMs` and the whole request, body included, within `requestTimeoutMs` (Node's defaults
 * are 60 s and 300 s), or the connection is answered 408 and closed. Node checks these every
 * `connectionsCheckingInterval`, 1 s here instead of 30 s, so a slow body is cut off close to its limit.
 * Answers may take longer (a sweep): the limits stop counting once the request has arrived.
 */
export function createHttpServer(app: Express, config: Pick<Config, "http">): Server {
  return createServer(
    {
      headersTimeout: config.http.headersTimeoutMs,
      requestTimeout: config.http.requestTimeoutMs,
      connectionsCheckingInterval: Math.min(1000, config.http.headersTimeoutMs),
    },
    app,
  );
}
