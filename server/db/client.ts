import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "./schema/index.js";

export type Db = NodePgDatabase<typeof schema> & { $client: pg.Pool };
/** A transaction handle; query functions accept `Db | Tx` so callers can compose them in one transaction. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
export type DbOrTx = Db | Tx;

export interface CreateDbOptions {
  /** Pool size (default 10). */
  max?: number;
  /** Milliseconds to wait for a connection before failing (default 5000). */
  connectionTimeoutMillis?: number;
}

/** A pg Pool and the Drizzle database on top of it. Close with `db.$client.end()`. */
export function createDb(connectionString: string, options: CreateDbOptions = {}): Db {
  const pool = new pg.Pool({
    connectionString,
    max: options.max ?? 10,
    connectionTimeoutMillis: options.connectionTimeoutMillis ?? 5000,
    idleTimeoutMillis: 30_000,
  });
  // An idle client losing its connection must not crash the process; the next query reports the error.
  pool.on("error", () => {});
  return drizzle(pool, { schema, casing: "snake_case" }) as Db;
}
