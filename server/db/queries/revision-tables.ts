import { eq, sql } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import { studyRevisionTables, type NewStudyRevisionTable } from "../schema/index.js";

export async function insertRevisionTable(db: DbOrTx, values: NewStudyRevisionTable): Promise<void> {
  await db.insert(studyRevisionTables).values(values);
}

/** A revision's step table without its bytes: branch ids, rows and compressed size; undefined when it has none. */
export async function findRevisionTableInfo(db: DbOrTx, revisionId: number) {
  const [row] = await db
    .select({
      branchIds: studyRevisionTables.branchIds,
      rowCount: studyRevisionTables.rowCount,
      byteLength: sql<number>`octet_length(${studyRevisionTables.csvGzip})::int`,
    })
    .from(studyRevisionTables)
    .where(eq(studyRevisionTables.revisionId, revisionId));
  return row;
}

/** `length` bytes of a revision's compressed table from byte `offset` (0-based); empty past the end. */
export async function readRevisionTableSlice(db: DbOrTx, revisionId: number, offset: number, length: number): Promise<Buffer> {
  const { rows } = await db.execute<{ slice: Buffer }>(
    sql`select substring(${studyRevisionTables.csvGzip} from ${offset + 1}::int for ${length}::int) as slice
        from ${studyRevisionTables} where ${studyRevisionTables.revisionId} = ${revisionId}`,
  );
  return rows[0]?.slice ?? Buffer.alloc(0);
}
