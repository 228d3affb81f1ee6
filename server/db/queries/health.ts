import { sql } from "drizzle-orm";
import type { DbOrTx } from "../client.js";

/** One trivial round trip: resolves when PostgreSQL answers, rejects with the driver's error otherwise. */
export async function pingDatabase(db: DbOrTx): Promise<void> {
  await db.execute(sql`select 1`);
}
