import { parseStudy, type StudyDocument, type StudyIssue } from "@shared/schemas/study";

/** A study file read in the browser before anything is uploaded. */
export type StudyFileReading =
  | { ok: true; study: StudyDocument }
  | { ok: false; problem: string; issues: StudyIssue[] };

/**
 * Reads a study file as the server's import will (JSON, then the `stillspan.study/1` schema with its defaults), so
 * what it would change can be shown before a revision is created. The server reads and checks it again on import.
 */
export async function readStudyFile(file: File): Promise<StudyFileReading> {
  let json: unknown;
  try {
    json = JSON.parse(await file.text());
  } catch (error) {
    return { ok: false, problem: `not valid JSON (${error instanceof Error ? error.message : String(error)})`, issues: [] };
  }
  const parsed = parseStudy(json);
  if (parsed.ok) return { ok: true, study: parsed.study };
  const n = parsed.issues.length;
  return { ok: false, problem: `${n} value${n === 1 ? " does" : "s do"} not follow the study format`, issues: parsed.issues };
}
