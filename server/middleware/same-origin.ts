/**
 * Refuses requests that change something when a browser says they come from another site (cross-site request
 * forgery). SameSite=Lax cookies alone do not cover every case (a form or fetch from a sibling site, older
 * browsers), so every API method other than GET, HEAD and OPTIONS is checked here, before any body is read:
 *
 * - `Sec-Fetch-Site: cross-site` → 403;
 * - an `Origin` header that is not the app's own → 403 (`Origin: null`, sent by sandboxed frames and some
 *   redirects, is not the app's own either);
 * - no `Origin` header → allowed: scripts, the CLI's users and curl send none, and browsers always send one on
 *   such requests.
 *
 * The app's own origins: the one the request was addressed to (its Host header, which a browser sets to the
 * site it is talking to) and the configured public address (STILLSPAN_PUBLIC_URL), for a reverse proxy that
 * rewrites Host.
 */
import type { Request, RequestHandler } from "express";
import type { Config } from "../config.js";
import { AppError } from "../errors.js";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

function originHost(origin: string): string | undefined {
  if (!URL.canParse(origin)) return undefined;
  const url = new URL(origin);
  return url.protocol === "http:" || url.protocol === "https:" ? url.host : undefined;
}

/** True when `origin` names the site this request was sent to, or the configured public address. */
function isOwnOrigin(req: Pick<Request, "headers">, origin: string, publicUrl: string): boolean {
  const host = originHost(origin);
  if (host === undefined) return false;
  if (URL.canParse(publicUrl) && new URL(publicUrl).origin === new URL(origin).origin) return true;
  // Host (not the scheme) is compared: behind a TLS-terminating proxy the app sees http while the page is https.
  const requestHost = req.headers.host?.toLowerCase();
  return requestHost !== undefined && requestHost === host;
}

const refused = (why: string) =>
  new AppError(
    403,
    "cross_origin",
    `Refused: this request came from another site (${why}). Stillspan accepts changes only from its own pages, or from scripts that send no Origin header.`,
  );

/** The guard, mounted on /api before the body parsers and every route. */
export function sameOriginGuard(config: Pick<Config, "publicUrl">): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    if (req.headers["sec-fetch-site"] === "cross-site") return next(refused("Sec-Fetch-Site: cross-site"));
    const origin = req.headers.origin;
    if (origin !== undefined && !isOwnOrigin(req, origin, config.publicUrl)) {
      return next(refused(`Origin ${origin.slice(0, 100)}`));
    }
    next();
  };
}
