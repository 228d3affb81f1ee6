import { convertConvention } from "../../shared/engine/aero/convert-convention.js";
import { fitStaticSlopes } from "../../shared/datasets/fit-static-slopes.js";
import { capIssues } from "../../shared/datasets/read-csv-table.js";
import { readFlutterDerivativesCsv } from "../../shared/datasets/read-flutter-derivatives-csv.js";
import { readStaticCoefficientsCsv } from "../../shared/datasets/read-static-coefficients-csv.js";
import {
  datasetMetaSchema,
  type DatasetDto,
  type DatasetMeta,
  type PatchDataset,
  type UploadIssue,
} from "../../shared/schemas/datasets.js";
import { DERIVATIVE_NAMES, MAX_DERIVATIVE_MAGNITUDE, REDUCED_VELOCITY_LIMITS } from "../../shared/schemas/study.js";
import { extent } from "../../shared/extent.js";
import { clipValue } from "../../shared/message-bounds.js";
import type { DbOrTx } from "../db/client.js";
import { writeAudit } from "../db/queries/audit.js";
import { listAlternativeRevisionAerodynamics } from "../db/queries/revisions.js";
import {
  deleteDataset,
  findDataset,
  findDatasetFile,
  insertDataset,
  listDatasets,
  updateDataset,
  type DatasetRow,
} from "../db/queries/datasets.js";
import type { NewAeroDataset } from "../db/schema/index.js";
import { AppError, zodIssues } from "../errors.js";
import { sha256Hex } from "../lib/hash.js";
import { requireFile } from "../lib/uploads.js";
import { loadWithAccess, person, type Access } from "./access.js";
import { loadAlternative } from "./alternatives.js";
import { matchingDataset } from "./summary-inputs.js";
import type { SessionUser } from "./auth.js";

export function toDatasetDto(row: DatasetRow): DatasetDto {
  return {
    id: String(row.id),
    alternativeId: String(row.alternativeId),
    projectId: String(row.projectId),
    name: row.name,
    kind: row.kind,
    meanAngleDeg: row.meanAngleDeg,
    provenance: row.provenance,
    convention: row.convention ?? null,
    dragReference: (row.dragReference as "B" | "D" | null) ?? null,
    deckWidthM: row.deckWidthM,
    deckDepthM: row.deckDepthM,
    delivered: row.delivered as DatasetDto["delivered"],
    converted: row.converted as DatasetDto["converted"],
    slopes: (row.slopes as DatasetDto["slopes"]) ?? null,
    testedRange: { min: row.testedMin, max: row.testedMax },
    warnings: row.warnings,
    file: { name: row.fileName, sizeBytes: row.fileSizeBytes, sha256: row.fileSha256 },
    createdAt: row.createdAt.toISOString(),
    createdBy: person(row.createdById, row.createdByName),
  };
}

function loadDataset(db: DbOrTx, user: SessionUser, id: number, access: Access) {
  return loadWithAccess(db, user, "Data set", () => findDataset(db, id), access);
}

function invalidFile(fileName: string, issues: UploadIssue[]): AppError {
  const first = issues[0];
  // A blank header cell's column is already named "column 3"; a message that ends with a period keeps one.
  const column = first.column ? (/^column \d+$/.test(first.column) ? first.column : `column ${first.column}`) : "";
  const where = [first.row !== undefined ? `line ${first.row}` : "", column].filter(Boolean).join(", ");
  const more = issues.length > 1 ? ` (and ${issues.length - 1} more)` : "";
  const message = first.message.replace(/\.$/, "");
  return new AppError(400, "invalid_file", `${clipValue(fileName)}: ${where ? `${where}: ` : ""}${message}${more}. Nothing was stored.`, {
    details: issues,
  });
}

/** Parses the `meta` part; its problems are reported like a body's, under `meta.<path>`. */
export function parseMeta(raw: unknown): DatasetMeta {
  if (typeof raw !== "string" || raw.trim() === "") {
    throw AppError.badRequest('Send the data set\'s description as the multipart field "meta" (a JSON text).');
  }
  let json: unknown;
  try {
    json = JSON.parse(raw);
  } catch {
    throw AppError.badRequest('The field "meta" is not valid JSON.');
  }
  const result = datasetMetaSchema.safeParse(json);
  if (!result.success) {
    const details = zodIssues(result.error).map((d) => ({ ...d, path: `meta.${d.path === "(body)" ? "" : d.path}`.replace(/\.$/, "") }));
    throw new AppError(400, "invalid_input", `Invalid input — ${details.map((d) => `${d.path}: ${d.message}`).join("; ")}`, { details });
  }
  return result.data;
}

type Parsed = Pick<NewAeroDataset, "delivered" | "converted" | "slopes" | "testedMin" | "testedMax" | "warnings">;

function parseFlutter(bytes: Uint8Array, fileName: string, meta: Extract<DatasetMeta, { kind: "flutter-derivatives" }>): Parsed {
  const read = readFlutterDerivativesCsv(bytes, meta.convention.abscissa);
  if (!read.ok) throw invalidFile(fileName, read.issues);
  const { abscissa, ...derivatives } = read.delivered;
  const converted = convertConvention({ ...meta.convention, abscissaValues: abscissa, ...derivatives });
  const ur = converted.reducedVelocity;
  const full = { reducedVelocity: ur, ...Object.fromEntries(DERIVATIVE_NAMES.map((n) => [n, converted[n]!])) };
  // The study format takes |derivative| ≤ 100,000 and 0.01 ≤ Ur ≤ 1,000; a file beyond them would be stored and
  // then refused only when a study tried to use it. Refuse it here, naming the data row and the column.
  const beyond: UploadIssue[] = [];
  for (const name of DERIVATIVE_NAMES) {
    (derivatives[name] ?? []).forEach((v, i) => {
      if (Math.abs(v) > MAX_DERIVATIVE_MAGNITUDE) {
        beyond.push({ column: name, message: `data row ${i + 1}: ${v} is beyond ±${MAX_DERIVATIVE_MAGNITUDE} (a typing or unit error?)` });
      }
    });
  }
  const { min: lowest, max: highest } = extent(ur);
  const { min, max } = REDUCED_VELOCITY_LIMITS;
  if (highest > max) {
    beyond.push({ column: meta.convention.abscissa, message: `gives a reduced velocity Ur = U/(fB) of ${Number(highest.toPrecision(6))}, beyond ${max}` });
  }
  if (lowest < min) {
    beyond.push({ column: meta.convention.abscissa, message: `gives a reduced velocity Ur = U/(fB) of ${Number(lowest.toPrecision(6))}, below ${min}` });
  }
  if (beyond.length > 0) throw invalidFile(fileName, capIssues(beyond));
  return {
    delivered: read.delivered,
    converted: full,
    slopes: null,
    testedMin: ur[0],
    testedMax: ur[ur.length - 1],
    warnings: read.warnings,
  };
}

function parseStatic(
  bytes: Uint8Array,
  fileName: string,
  meta: Extract<DatasetMeta, { kind: "static-coefficients" }>,
  deck: { deckWidthM: number; deckDepthM: number },
): Parsed {
  const read = readStaticCoefficientsCsv(bytes);
  if (!read.ok) throw invalidFile(fileName, read.issues);
  const toB = meta.dragReference === "D" ? deck.deckDepthM / deck.deckWidthM : 1;
  const onB = read.rows.map((r) => ({ ...r, CD: r.CD * toB }));
  const fit = fitStaticSlopes(onB, meta.slopeWindow);
  if (!fit.ok) {
    throw AppError.badRequest(
      `meta.slopeWindow: the window ${meta.slopeWindow.fromDeg}° to ${meta.slopeWindow.toDeg}° holds ${fit.pointCount} row(s) of the file; at least 2 are needed. Nothing was stored.`,
      [{ path: "meta.slopeWindow", message: `holds ${fit.pointCount} rows; at least 2 are needed` }],
    );
  }
  const warnings = [...read.warnings];
  if (meta.slopeWindow.fromDeg > 0 || meta.slopeWindow.toDeg < 0) {
    warnings.push({ message: "The fitting window does not contain 0°: the values at 0° are extrapolated." });
  }
  return {
    delivered: { rows: read.rows },
    converted: { rows: onB },
    slopes: fit.slopes as unknown as Record<string, unknown>,
    testedMin: read.rows[0].angleDeg,
    testedMax: read.rows[read.rows.length - 1].angleDeg,
    warnings,
  };
}

/** Validates, converts and stores an uploaded data set with its original file; nothing is written on rejection. */
export async function uploadDataset(
  db: DbOrTx,
  user: SessionUser,
  alternativeId: number,
  upload: { metaField: unknown; file: { buffer: Buffer; originalname: string } | undefined },
  ip?: string,
): Promise<DatasetDto> {
  const alternative = await loadAlternative(db, user, alternativeId, "write");
  const { buffer, originalname } = requireFile(upload.file, "file");
  const meta = parseMeta(upload.metaField);
  const parsed =
    meta.kind === "flutter-derivatives"
      ? parseFlutter(buffer, originalname, meta)
      : parseStatic(buffer, originalname, meta, alternative);
  const fileSha256 = sha256Hex(buffer);
  return db.transaction(async (tx) => {
    const id = await insertDataset(tx, {
      alternativeId,
      name: meta.name,
      kind: meta.kind,
      meanAngleDeg: meta.meanAngleDeg,
      provenance: meta.provenance,
      convention: meta.kind === "flutter-derivatives" ? meta.convention : null,
      dragReference: meta.kind === "static-coefficients" ? meta.dragReference : null,
      deckWidthM: alternative.deckWidthM,
      deckDepthM: alternative.deckDepthM,
      ...parsed,
      fileName: originalname.slice(0, 255),
      fileBytes: buffer,
      fileSha256,
      fileSizeBytes: buffer.length,
      createdBy: user.id,
    });
    await writeAudit(tx, {
      actorId: user.id,
      action: "dataset.create",
      objectType: "dataset",
      objectId: id,
      ip,
      details: { alternativeId, kind: meta.kind, name: meta.name, fileSha256, fileSizeBytes: buffer.length },
    });
    return toDatasetDto((await findDataset(tx, id))!);
  });
}

export async function listAlternativeDatasets(db: DbOrTx, user: SessionUser, alternativeId: number): Promise<DatasetDto[]> {
  await loadAlternative(db, user, alternativeId, "read");
  return (await listDatasets(db, alternativeId)).map(toDatasetDto);
}

export async function getDataset(db: DbOrTx, user: SessionUser, id: number): Promise<DatasetDto> {
  return toDatasetDto(await loadDataset(db, user, id, "read"));
}

export async function getDatasetFile(db: DbOrTx, user: SessionUser, id: number) {
  await loadDataset(db, user, id, "read");
  return (await findDatasetFile(db, id))!;
}

export async function patchDataset(db: DbOrTx, user: SessionUser, id: number, patch: PatchDataset, ip?: string): Promise<DatasetDto> {
  await loadDataset(db, user, id, "write");
  return db.transaction(async (tx) => {
    await updateDataset(tx, id, patch);
    await writeAudit(tx, { actorId: user.id, action: "dataset.update", objectType: "dataset", objectId: id, ip, details: { fields: Object.keys(patch) } });
    return toDatasetDto((await findDataset(tx, id))!);
  });
}

/**
 * Deletes a data set that no stored revision uses. A revision whose derivative table is this data set's converted
 * table names it as the source of its aerodynamics (signed summaries print its file and facility), so while any
 * revision uses it the deletion is refused with the revisions listed (409 `dataset_in_use`).
 */
export async function removeDataset(db: DbOrTx, user: SessionUser, id: number, ip?: string): Promise<void> {
  const row = await loadDataset(db, user, id, "write");
  const usedBy = (await listAlternativeRevisionAerodynamics(db, row.alternativeId)).filter(
    (r) => matchingDataset([row], r.aerodynamics) !== undefined,
  );
  if (usedBy.length > 0) {
    const named = usedBy.slice(0, 3).map((r) => `r${r.number} of “${r.studyName}”`).join(", ");
    const more = usedBy.length > 3 ? ` and ${usedBy.length - 3} more` : "";
    throw new AppError(
      409,
      "dataset_in_use",
      `“${row.name}” is the aerodynamics of ${named}${more}; revisions are kept for good, so it cannot be deleted.`,
      { details: usedBy.map((r) => ({ study: r.studyName, revision: r.number })) },
    );
  }
  await db.transaction(async (tx) => {
    await deleteDataset(tx, id);
    await writeAudit(tx, {
      actorId: user.id,
      action: "dataset.delete",
      objectType: "dataset",
      objectId: id,
      ip,
      details: { alternativeId: row.alternativeId, name: row.name, fileSha256: row.fileSha256 },
    });
  });
}

