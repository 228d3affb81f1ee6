/**
 * Bad input of other kinds that once got a 500, a silent change or an answer of megabytes: bytes that are not
 * UTF-8, CSV files that crashed the reader or echoed themselves, numbers the engine cannot use, and a damping
 * ratio typed as a percentage. Each gets a 4xx that names what and where, and nothing is stored.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openTestDb } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api } from "../support/http.js";
import { postRawMultipart } from "../support/multipart.js";
import { analystWorkspace, flutterMeta, inventedStudy, readFixture, rowCounts, upload } from "../support/workspace.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
/** The demo analyst's fresh project, alternative and study. */
let ws: Awaited<ReturnType<typeof analystWorkspace>>;
beforeAll(async () => void (ws = await analystWorkspace(db, base(), "Bad input")));
afterAll(() => db.$client.end());

/** "café" in Latin-1: the byte 0xE9 alone is not UTF-8. */
const LATIN1_CAFE = Buffer.from("caf\u00e9", "latin1");

describe("bytes that are not UTF-8", () => {
  it("in a JSON body: 400 invalid_utf8 naming the byte, and nothing is stored (once stored with U+FFFD)", async () => {
    const body = Buffer.concat([Buffer.from('{"purpose":"'), LATIN1_CAFE, Buffer.from('"}')]);
    const res = await fetch(`${base()}/api/studies/${ws.studyId}`, {
      method: "PATCH",
      headers: { "Content-Type": "application/json", Cookie: ws.cookie },
      body,
    });
    const answer = await res.json();
    expect(res.status).toBe(400);
    expect(answer.error).toMatchObject({ code: "invalid_utf8", message: expect.stringMatching(/not valid UTF-8: byte 0xe9 at line 1/) });
    expect(answer.error.details).toEqual([{ path: "(body)", rule: "utf8", message: "is not valid UTF-8: byte 0xe9 at line 1", line: 1, offset: 15 }]);
    const study = await api(base(), `/api/studies/${ws.studyId}`, { cookie: ws.cookie });
    expect(study.body.purpose).toBe("API test");
  });

  it("in a study file: the import refuses the same bytes, with the line", async () => {
    const utf8 = Buffer.from(JSON.stringify({ ...inventedStudy(), name: "caf\u00e9" }, null, 2));
    const at = utf8.indexOf(Buffer.from("caf\u00e9"));
    const file = Buffer.concat([utf8.subarray(0, at), LATIN1_CAFE, utf8.subarray(at + 5)]); // é: C3 A9 → E9
    const res = await upload(base(), `/api/studies/${ws.studyId}/import`, {
      cookie: ws.cookie,
      field: "file",
      file: { name: "latin1.study.json", bytes: file, type: "application/json" },
      fields: { parentRevision: "1" },
    });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: "invalid_file", message: expect.stringMatching(/not UTF-8 text \(byte 0xe9 at line 3\)/) });
  });

  it("in a multipart text field: 400 naming the field; UTF-8 text in the same fields arrives intact", async () => {
    const before = await rowCounts(db);
    const study = Buffer.from(JSON.stringify(inventedStudy()));
    const bad = await postRawMultipart(`${base()}/api/studies/${ws.studyId}/import`, [
      { name: "parentRevision", bytes: "1" },
      { name: "changeNote", bytes: LATIN1_CAFE },
      { name: "file", filename: "s.json", type: "application/json", bytes: study },
    ], { cookie: ws.cookie });
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatchObject({ code: "invalid_utf8", message: expect.stringMatching(/The field "changeNote" is not valid UTF-8: byte 0xe9/) });
    expect(bad.body.error.details[0]).toMatchObject({ path: "changeNote", line: 1 });
    expect(await rowCounts(db)).toEqual(before);

    const name = "Windkanal Ærø — 1:60 🌉";
    const good = await upload(base(), `/api/alternatives/${ws.alternativeId}/datasets`, {
      cookie: ws.cookie,
      field: "file",
      file: { name: "derivatives.csv", bytes: readFixture("uploads/flutter-derivatives.csv"), type: "text/csv" },
      fields: { meta: flutterMeta({ name }) },
    });
    expect(good.status).toBe(201);
    expect(good.body.name).toBe(name);
  });
});

const uploadCsv = (name: string, text: string | Buffer) =>
  upload(base(), `/api/alternatives/${ws.alternativeId}/datasets`, {
    cookie: ws.cookie,
    field: "file",
    file: { name, bytes: typeof text === "string" ? Buffer.from(text) : text, type: "text/csv" },
    fields: { meta: flutterMeta({ convention: { abscissa: "K", normalisation: "B", sign: "h-down" } }) },
  });

describe("CSV files that once crashed the reader or came back whole", () => {
  it("a K file of 125,000 rows (under 1 MB; once a stack overflow) → 400 naming the row limit and the line", async () => {
    const rows = Array.from({ length: 125_000 }, (_, i) => String((125_000 - i) / 10_000));
    const text = `K\n${rows.join("\n")}\n`;
    expect(text.length).toBeLessThan(1024 * 1024);
    const before = await rowCounts(db);
    const res = await uploadCsv("long-k.csv", text);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({
      code: "invalid_file",
      message: "long-k.csv: line 10002: The file has 125000 data rows; at most 10000 are accepted (line 10002 is row 10001). Nothing was stored.",
      details: [{ row: 10_002, message: "The file has 125000 data rows; at most 10000 are accepted (line 10002 is row 10001)." }],
    });
    expect(await rowCounts(db)).toEqual(before);
  });

  it("a file of only commas (once a 500: the reader crashed) → 400 naming line 1, column 1", async () => {
    const res = await uploadCsv("only-commas.csv", readFixture("bad-uploads/only-commas.csv"));
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/^only-commas\.csv: line 1, column 1: the header has no column names/);
  });

  it("a K table that converts to Ur below 0.01 is refused like one beyond 1000", async () => {
    const res = await uploadCsv("tiny-ur.csv", "K,H1\n1000,1\n2000,1\n");
    expect(res.status).toBe(400);
    expect(res.body.error.details[0]).toMatchObject({ column: "K", message: expect.stringMatching(/reduced velocity Ur = U\/\(fB\) of 0\.00314159\d*, below 0\.01/) });
  });

  it("a 1 MB header cell is quoted to ~100 characters: the answer stays small (once 4.2 MB)", async () => {
    const res = await uploadCsv("wide-header.csv", `K,${"H".repeat(1_000_000)}\n1,2\n2,3\n`);
    const size = JSON.stringify(res.body).length;
    expect(res.status).toBe(400);
    expect(size).toBeLessThan(2_000);
    expect(res.body.error.details[0]).toMatchObject({ row: 1, message: expect.stringMatching(/^"H{100}…" \(1000000 characters\) is not a known column/) });
  });
});

describe("numbers the engine cannot use", () => {
  const sweep = (mutate: (doc: any) => void) => {
    const doc = inventedStudy();
    mutate(doc);
    return api(base(), "/api/sweep", { cookie: ws.cookie, body: doc });
  };

  it("sweep.from = 1e-320 → 400 naming $.sweep.from (once a 422 'got NaN' naming nothing)", async () => {
    const res = await sweep((d) => (d.sweep.from = 1e-320));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("invalid_study");
    expect(res.body.error.details).toEqual([{ path: "$.sweep.from", message: expect.stringMatching(/denormal/) }]);
  });

  it("a structural damping typed as a percentage (0.5 for 0.5 %) → 400 saying it is a ratio", async () => {
    const res = await sweep((d) => (d.structure.modes[1].damping = 0.5));
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([
      { path: "$.structure.modes[1].damping", message: "must be at most 0.2: damping is a ratio: 0.005 is 0.5 % (0.5 would be 50 %)" },
    ]);
  });
});
