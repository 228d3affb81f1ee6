import type { Db } from "../db/client.js";
import { pingDatabase } from "../db/queries/health.js";
import type { Logger } from "../logger.js";

/**
 * Whether PostgreSQL answers, for the health check. A failure is what the check reports (503), not an error of the
 * request: it is logged as a warning with the driver's message only.
 */
export async function databaseIsUp(db: Db, logger: Logger): Promise<boolean> {
  try {
    await pingDatabase(db);
    return true;
  } catch (err) {
    logger.warn({ err: (err as Error).message }, "health check: database unreachable");
    return false;
  }
}
