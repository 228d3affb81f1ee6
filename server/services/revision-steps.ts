import { Readable } from "node:stream";
import type { DbOrTx } from "../db/client.js";
import { findRevisionTableInfo, readRevisionTableSlice } from "../db/queries/revision-tables.js";
import { findRevision, findRevisionHeader } from "../db/queries/revisions.js";
import { fileSlug } from "../lib/file-name.js";
import type { StepsTableSource } from "../lib/send-steps-table.js";
import { stepsCsvChunks } from "../lib/steps-table.js";
import { loadWithAccess } from "./access.js";
import type { SessionUser } from "./auth.js";

/** Bytes of the compressed table read per query while streaming a download. */
const SLICE_BYTES = 256 * 1024;

/**
 * A stored revision's full step table for a download (analysts and reviewers of its project): read from the
 * database in slices of 256 kB as the client takes them. Revisions stored before step tables were kept apart
 * hold every step in their result; their table is written from it.
 */
export async function revisionStepsTable(db: DbOrTx, user: SessionUser, id: number): Promise<StepsTableSource> {
  const header = await loadWithAccess(db, user, "Revision", () => findRevisionHeader(db, id), "read");
  const fileStem = `${fileSlug(header.studyName)}-r${header.number}-steps`;
  const info = await findRevisionTableInfo(db, id);
  if (info) {
    async function* slices() {
      for (let offset = 0; offset < info!.byteLength; offset += SLICE_BYTES) yield await readRevisionTableSlice(db, id, offset, SLICE_BYTES);
    }
    return { open: () => Readable.from(slices()), gzipped: true, branchIds: info.branchIds, engine: header.engineVersion, fileStem };
  }
  const { result } = (await findRevision(db, id))!;
  return {
    open: () => Readable.from(stepsCsvChunks(result)),
    gzipped: false,
    branchIds: result.modes.map((m) => m.id),
    engine: header.engineVersion,
    fileStem,
  };
}
