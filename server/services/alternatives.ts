import type { AlternativeDto, CreateAlternative, PatchAlternative } from "../../shared/schemas/alternatives.js";
import type { DbOrTx } from "../db/client.js";
import { writeAudit } from "../db/queries/audit.js";
import {
  deleteAlternative,
  findAlternative,
  findAlternativeImage,
  insertAlternative,
  listAlternatives,
  setAlternativeImage,
  updateAlternative,
  type AlternativeRow,
} from "../db/queries/alternatives.js";
import { AppError } from "../errors.js";
import { checkImage } from "../lib/check-image.js";
import { requireFile } from "../lib/uploads.js";
import { sha256Hex } from "../lib/hash.js";
import { assertRole, loadWithAccess, READ_ROLES, WRITE_ROLES, type Access } from "./access.js";
import type { SessionUser } from "./auth.js";

export function toAlternativeDto(row: AlternativeRow): AlternativeDto {
  return {
    id: String(row.id),
    projectId: String(row.projectId),
    name: row.name,
    description: row.description,
    deckWidthM: row.deckWidthM,
    deckDepthM: row.deckDepthM,
    image:
      row.imageContentType && row.imageSha256 && row.imageUploadedAt
        ? {
            contentType: row.imageContentType as NonNullable<AlternativeDto["image"]>["contentType"],
            sizeBytes: row.imageSizeBytes ?? 0,
            sha256: row.imageSha256,
            uploadedAt: row.imageUploadedAt.toISOString(),
          }
        : null,
    studyCount: row.studyCount,
    datasetCount: row.datasetCount,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** The alternative once the caller may read or write it (404, then 403). */
export function loadAlternative(db: DbOrTx, user: SessionUser, id: number, access: Access) {
  return loadWithAccess(db, user, "Alternative", () => findAlternative(db, id), access);
}

export async function listProjectAlternatives(db: DbOrTx, user: SessionUser, projectId: number): Promise<AlternativeDto[]> {
  await assertRole(db, user, projectId, READ_ROLES);
  return (await listAlternatives(db, projectId)).map(toAlternativeDto);
}

export async function getAlternative(db: DbOrTx, user: SessionUser, id: number): Promise<AlternativeDto> {
  return toAlternativeDto(await loadAlternative(db, user, id, "read"));
}

export async function createAlternative(
  db: DbOrTx,
  user: SessionUser,
  projectId: number,
  input: CreateAlternative,
  ip?: string,
): Promise<AlternativeDto> {
  await assertRole(db, user, projectId, WRITE_ROLES);
  return db.transaction(async (tx) => {
    const id = await insertAlternative(tx, { ...input, projectId, createdBy: user.id });
    await writeAudit(tx, {
      actorId: user.id,
      action: "alternative.create",
      objectType: "alternative",
      objectId: id,
      ip,
      details: { projectId, name: input.name, deckWidthM: input.deckWidthM, deckDepthM: input.deckDepthM },
    });
    return toAlternativeDto((await findAlternative(tx, id))!);
  });
}

export async function patchAlternative(
  db: DbOrTx,
  user: SessionUser,
  id: number,
  patch: PatchAlternative,
  ip?: string,
): Promise<AlternativeDto> {
  await loadAlternative(db, user, id, "write");
  return db.transaction(async (tx) => {
    await updateAlternative(tx, id, patch);
    await writeAudit(tx, { actorId: user.id, action: "alternative.update", objectType: "alternative", objectId: id, ip, details: { ...patch } });
    return toAlternativeDto((await findAlternative(tx, id))!);
  });
}

/** Deletes an alternative and its data sets; refused (409) while it has studies, whose revisions are kept forever. */
export async function removeAlternative(db: DbOrTx, user: SessionUser, id: number, ip?: string): Promise<void> {
  const row = await loadAlternative(db, user, id, "write");
  if (row.studyCount > 0) {
    throw new AppError(409, "has_studies", `"${row.name}" has ${row.studyCount} stud${row.studyCount === 1 ? "y" : "ies"}; study revisions are kept for good, so it cannot be deleted.`);
  }
  await db.transaction(async (tx) => {
    await deleteAlternative(tx, id);
    await writeAudit(tx, {
      actorId: user.id,
      action: "alternative.delete",
      objectType: "alternative",
      objectId: id,
      ip,
      details: { projectId: row.projectId, name: row.name, datasetCount: row.datasetCount },
    });
  });
}

/** Stores (or replaces) the cross-section image after checking its type by content type and magic bytes. */
export async function setImage(
  db: DbOrTx,
  user: SessionUser,
  id: number,
  upload: { buffer: Buffer; mimetype: string; originalname: string } | undefined,
  ip?: string,
): Promise<AlternativeDto> {
  await loadAlternative(db, user, id, "write");
  const file = requireFile(upload, "image");
  const checked = checkImage(file.buffer, file.mimetype);
  if (!checked.ok) throw new AppError(400, "invalid_image", `${checked.message} Nothing was stored.`);
  const sha256 = sha256Hex(file.buffer);
  return db.transaction(async (tx) => {
    await setAlternativeImage(tx, id, { bytes: file.buffer, contentType: checked.type, sha256 });
    await writeAudit(tx, {
      actorId: user.id,
      action: "alternative.image.set",
      objectType: "alternative",
      objectId: id,
      ip,
      details: { contentType: checked.type, sizeBytes: file.buffer.length, sha256, fileName: file.originalname },
    });
    return toAlternativeDto((await findAlternative(tx, id))!);
  });
}

export async function removeImage(db: DbOrTx, user: SessionUser, id: number, ip?: string): Promise<void> {
  const row = await loadAlternative(db, user, id, "write");
  if (!row.imageSha256) throw AppError.notFound("Image");
  await db.transaction(async (tx) => {
    await setAlternativeImage(tx, id, null);
    await writeAudit(tx, { actorId: user.id, action: "alternative.image.delete", objectType: "alternative", objectId: id, ip, details: { sha256: row.imageSha256 } });
  });
}

export async function getImage(db: DbOrTx, user: SessionUser, id: number): Promise<{ bytes: Buffer; contentType: string; sha256: string }> {
  await loadAlternative(db, user, id, "read");
  const image = await findAlternativeImage(db, id);
  if (!image?.bytes || !image.contentType || !image.sha256) throw AppError.notFound("Image");
  return { bytes: image.bytes, contentType: image.contentType, sha256: image.sha256 };
}
