/** Helpers for the alternatives / data sets / studies / revisions API tests. */
import { readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { sql } from "drizzle-orm";
import type { Db } from "../../server/db/client.js";
import { createProjectWithMembers } from "./db.js";
import { api, signIn, type ApiResponse } from "./http.js";

const here = path.dirname(fileURLToPath(import.meta.url));
export const fixturesDir = path.resolve(here, "../fixtures");

export const readFixture = (relative: string): Buffer => readFileSync(path.join(fixturesDir, relative));

/** The invented deck study used by the schema tests: a valid `stillspan.study/1` document. */
export function inventedStudy(): any {
  return JSON.parse(readFileSync(path.resolve(here, "../../shared/schemas/__tests__/fixtures/invented-deck-study.json"), "utf8"));
}

/** A multipart POST/PUT with one file part and text fields. */
export async function upload<T = any>(
  baseUrl: string,
  urlPath: string,
  options: {
    cookie?: string;
    method?: string;
    field: string;
    file: { name: string; bytes: Uint8Array; type: string };
    fields?: Record<string, string>;
    headers?: Record<string, string>;
  },
): Promise<ApiResponse<T>> {
  const form = new FormData();
  for (const [k, v] of Object.entries(options.fields ?? {})) form.append(k, v);
  form.append(options.field, new Blob([new Uint8Array(options.file.bytes)], { type: options.file.type }), options.file.name);
  const headers: Record<string, string> = { Accept: "application/json", ...options.headers };
  if (options.cookie) headers.Cookie = options.cookie;
  const res = await fetch(`${baseUrl}${urlPath}`, { method: options.method ?? "POST", headers, body: form });
  const text = await res.text();
  const body = (res.headers.get("content-type") ?? "").includes("application/json") && text ? JSON.parse(text) : text;
  return { status: res.status, headers: res.headers, body: body as T };
}

export const flutterMeta = (overrides: Record<string, unknown> = {}) =>
  JSON.stringify({
    kind: "flutter-derivatives",
    name: "Test section model",
    meanAngleDeg: 0,
    convention: { abscissa: "Ur", normalisation: "B", sign: "h-down" },
    provenance: { flow: "smooth", facility: "Test rig (invented)", modelScale: 50 },
    ...overrides,
  });

export const staticMeta = (overrides: Record<string, unknown> = {}) =>
  JSON.stringify({
    kind: "static-coefficients",
    name: "Test static coefficients",
    dragReference: "D",
    slopeWindow: { fromDeg: -2, toDeg: 2 },
    provenance: { flow: "smooth" },
    ...overrides,
  });

/** Row counts of the tables these routes write (to prove a refused request wrote nothing). */
export async function rowCounts(db: Db): Promise<Record<string, number>> {
  const { rows } = await db.execute<{ t: string; n: number }>(sql`
    select 'alternatives' as t, count(*)::int as n from alternatives
    union all select 'aero_datasets', count(*)::int from aero_datasets
    union all select 'studies', count(*)::int from studies
    union all select 'study_revisions', count(*)::int from study_revisions
    union all select 'audit_events', count(*)::int from audit_events`);
  return Object.fromEntries(rows.map((r) => [r.t, Number(r.n)]));
}

/** Audit events written after `afterId`, oldest first. */
export async function auditSince(db: Db, afterId: number) {
  const { rows } = await db.execute<{ id: number; action: string; object_type: string; object_id: string; actor_id: number | null }>(
    sql`select id, action, object_type, object_id, actor_id from audit_events where id > ${afterId} order by id`,
  );
  return rows;
}

export async function lastAuditId(db: Db): Promise<number> {
  const { rows } = await db.execute<{ id: number | null }>(sql`select max(id)::int as id from audit_events`);
  return Number(rows[0].id ?? 0);
}

/** Creates an alternative and a study with revision 1 as `cookie` (an analyst); returns their ids. */
export async function createAlternativeAndStudy(baseUrl: string, cookie: string, projectId: number | string) {
  const alt = await api(baseUrl, `/api/projects/${projectId}/alternatives`, {
    cookie,
    body: { name: "Test deck (invented)", deckWidthM: 27.5, deckDepthM: 3.6 },
  });
  if (alt.status !== 201) throw new Error(`alternative: ${alt.status} ${JSON.stringify(alt.body)}`);
  const study = await api(baseUrl, `/api/alternatives/${alt.body.id}/studies`, {
    cookie,
    body: { name: "Test study", purpose: "API test", study: inventedStudy() },
  });
  if (study.status !== 201) throw new Error(`study: ${study.status} ${JSON.stringify(study.body)}`);
  return { alternativeId: alt.body.id as string, studyId: study.body.id as string, revision1Id: study.body.latestRevision.id as string };
}

/** A fresh project whose analyst is the demo analyst, signed in, with an alternative and a study (revision 1). */
export async function analystWorkspace(db: Db, baseUrl: string, label: string) {
  const projectId = await createProjectWithMembers(db, `${label} ${Date.now().toString(36)}`, { "analyst@stillspan.test": "analyst" });
  const cookie = await signIn(baseUrl, "analyst@stillspan.test");
  return { projectId, cookie, ...(await createAlternativeAndStudy(baseUrl, cookie, projectId)) };
}
