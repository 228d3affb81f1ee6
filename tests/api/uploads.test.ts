import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openTestDb } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api } from "../support/http.js";
import { analystWorkspace, flutterMeta, readFixture, rowCounts, staticMeta, upload } from "../support/workspace.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
let analyst: string;
let alternativeId: string;
let studyId: string;

beforeAll(async () => {
  ({ cookie: analyst, alternativeId, studyId } = await analystWorkspace(db, base(), "Uploads test"));
});
afterAll(() => db.$client.end());

const uploadDataset = (name: string, bytes: Uint8Array, meta = flutterMeta(), type = "text/csv") =>
  upload(base(), `/api/alternatives/${alternativeId}/datasets`, { cookie: analyst, field: "file", file: { name, bytes, type }, fields: { meta } });

/** Every broken file, what it is uploaded as, and the problem the answer must name. */
const CORPUS: { file: string; as: "flutter" | "static" | "study"; issue: { row?: number; column?: string; message: RegExp } }[] = [
  { file: "unknown-column.csv", as: "flutter", issue: { row: 1, column: "A5", message: /"A5" is not a known column; expected Ur,H1,H2,H3,H4,A1,A2,A3,A4/ } },
  { file: "abscissa-not-first.csv", as: "flutter", issue: { row: 1, column: "H1", message: /first column must be the abscissa "Ur"/ } },
  { file: "repeated-column.csv", as: "flutter", issue: { row: 1, column: "H1", message: /column H1 appears twice/ } },
  { file: "text-in-number.csv", as: "flutter", issue: { row: 4, column: "H3", message: /"abc" is not a number/ } },
  { file: "nan-and-infinity.csv", as: "flutter", issue: { row: 3, column: "A1", message: /is NaN: only finite numbers/ } },
  { file: "unsorted-ur.csv", as: "flutter", issue: { row: 4, column: "Ur", message: /3 is smaller than 4 on line 3: reduced velocity \(Ur\) must increase strictly/ } },
  { file: "duplicate-ur.csv", as: "flutter", issue: { row: 4, column: "Ur", message: /repeats 4 from line 3: duplicate reduced velocity/ } },
  { file: "one-row.csv", as: "flutter", issue: { message: /1 data row\(s\); at least 2 are needed/ } },
  { file: "semicolons.csv", as: "flutter", issue: { row: 1, message: /separated by semicolons \(;\), not commas/ } },
  { file: "windows-1252.csv", as: "flutter", issue: { row: 3, message: /not UTF-8: byte 0x96 at line 3/ } },
  { file: "utf-16.csv", as: "flutter", issue: { message: /encoded as UTF-16/ } },
  { file: "bom-and-text.csv", as: "flutter", issue: { row: 3, column: "H2", message: /"x" is not a number/ } },
  { file: "short-row.csv", as: "flutter", issue: { row: 4, message: /has 8 values; the header has 9 columns/ } },
  { file: "derivative-beyond-range.csv", as: "flutter", issue: { column: "A4", message: /data row 2: 1e\+300 is beyond ±100000/ } },
  { file: "static-missing-column.csv", as: "static", issue: { row: 1, column: "CM", message: /column CM is missing/ } },
  { file: "only-commas.csv", as: "flutter", issue: { row: 1, column: "column 1", message: /no column names: the file holds only commas/ } },
  { file: "study-not-json.json", as: "study", issue: { row: 4, message: /JSON/ } },
];

describe("bad uploads are refused with the line and column, and nothing is written", () => {
  it.each(CORPUS)("$file → 400 naming the problem", async ({ file, as, issue }) => {
    const bytes = readFixture(`bad-uploads/${file}`);
    const before = await rowCounts(db);

    const res =
      as === "study"
        ? await upload(base(), `/api/studies/${studyId}/import`, {
            cookie: analyst,
            field: "file",
            file: { name: file, bytes, type: "application/json" },
            fields: { parentRevision: "1", changeNote: "import" },
          })
        : await uploadDataset(file, bytes, as === "static" ? staticMeta() : flutterMeta());

    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("invalid_file");
    expect(res.body.error.message).toContain(file);
    expect(res.body.error.message).toMatch(/Nothing was stored/);
    const first = res.body.error.details[0];
    expect(first.message).toMatch(issue.message);
    if (issue.row !== undefined) expect(first.row).toBe(issue.row);
    if (issue.column !== undefined) expect(first.column).toBe(issue.column);
    expect(await rowCounts(db)).toEqual(before);
  });

  it("reports both NaN and Infinity of one file, each at its line and column", async () => {
    const res = await uploadDataset("nan-and-infinity.csv", readFixture("bad-uploads/nan-and-infinity.csv"));
    expect(res.body.error.details).toEqual([
      { row: 3, column: "A1", message: "is NaN: only finite numbers are accepted" },
      { row: 5, column: "H2", message: "is Infinity: only finite numbers are accepted" },
    ]);
  });

  it("refuses a study file that breaks the format with 400 invalid_study at JSON paths", async () => {
    const before = await rowCounts(db);
    const res = await upload(base(), `/api/studies/${studyId}/import`, {
      cookie: analyst,
      field: "file",
      file: { name: "study-invalid.json", bytes: readFixture("bad-uploads/study-invalid.json"), type: "application/json" },
      fields: { parentRevision: "1", changeNote: "import" },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("invalid_study");
    expect(res.body.error.details).toEqual([
      { path: "$.deck.height", message: "is not a field of this format" },
      { path: "$.structure.modes[1].frequency", message: "must be greater than 0" },
    ]);
    expect(await rowCounts(db)).toEqual(before);
  });

  it("refuses a file over the 1 MB limit with 413 and writes nothing", async () => {
    const line = "12.5,-1.1,-0.5,-3.2,0.1,0.4,-0.3,1.2,0.05\n";
    const huge = new TextEncoder().encode("Ur,H1,H2,H3,H4,A1,A2,A3,A4\n" + line.repeat(Math.ceil((1.2 * 1024 * 1024) / line.length)));
    const before = await rowCounts(db);
    const res = await uploadDataset("huge.csv", huge);
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: "file_too_large", message: "The file is larger than the 1 MB limit. Nothing was stored." });
    expect(await rowCounts(db)).toEqual(before);
  });

  it("refuses a meta part that breaks its schema with the path of each field", async () => {
    const res = await uploadDataset("ok.csv", readFixture("uploads/flutter-derivatives.csv"), flutterMeta({ convention: { abscissa: "U", normalisation: "B", sign: "h-down" } }));
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual(["meta.convention.abscissa"]);
  });
});

describe("good uploads", () => {
  it("stores a flutter-derivative set as delivered and converted, with the original bytes and their SHA-256", async () => {
    const bytes = readFixture("uploads/flutter-derivatives.csv");
    const meta = flutterMeta({ convention: { abscissa: "Ur", normalisation: "2B", sign: "h-up" } });
    const res = await uploadDataset("flutter-derivatives.csv", bytes, meta);
    expect(res.status).toBe(201);
    expect(res.body.warnings).toEqual([]);
    expect(res.body.testedRange).toEqual({ min: 2, max: 10 });
    expect(res.body.delivered.H3[0]).toBe(-0.35);
    // 2B form: ×2; h and L upward: H2*, H3*, A1*, A4* change sign, H1*, H4*, A2*, A3* do not.
    expect(res.body.converted.H3[0]).toBe(0.7);
    expect(res.body.converted.H1[0]).toBe(-1.88);
    expect(res.body.converted.A1[0]).toBe(-0.46);
    expect(res.body.converted.A2[0]).toBe(-0.156);
    const original = await fetch(`${base()}/api/datasets/${res.body.id}/original`, { headers: { Cookie: analyst } });
    expect(Buffer.from(await original.arrayBuffer()).equals(bytes)).toBe(true);
    expect(original.headers.get("x-content-sha256")).toBe(res.body.file.sha256);
  });

  it("strips a UTF-8 BOM and reads CRLF lines", async () => {
    const res = await uploadDataset("bom.csv", readFixture("uploads/flutter-derivatives-bom.csv"));
    expect(res.status).toBe(201);
    expect(res.body.delivered.abscissa).toEqual([2, 4, 6, 8, 10]);
  });

  it("takes missing derivative columns as zeros and warns about each, and warns below 4 rows", async () => {
    const res = await uploadDataset("partial.csv", readFixture("uploads/flutter-derivatives-partial.csv"));
    expect(res.status).toBe(201);
    expect(res.body.converted.H2).toEqual([0, 0, 0]);
    expect(res.body.warnings.map((w: { column?: string }) => w.column ?? "rows")).toEqual(["rows", "H2", "H3", "H4", "A1", "A3", "A4"]);
  });

  it("fits static slopes at 0° by least squares over the chosen window and refers C_D to B", async () => {
    const res = await uploadDataset("static.csv", readFixture("uploads/static-coefficients.csv"), staticMeta({ slopeWindow: { fromDeg: -2, toDeg: 2 } }));
    expect(res.status).toBe(201);
    const s = res.body.slopes;
    // Rows −2°, 0°, 2°: C_L −0.19, −0.02, 0.15 → slope 0.085 per degree; C_M −0.027, 0.001, 0.029 → 0.014 per degree.
    expect(s.pointCount).toBe(3);
    expect(s.liftSlopePerRad).toBeCloseTo((0.085 * 180) / Math.PI, 10);
    expect(s.momentSlopePerRad).toBeCloseTo((0.014 * 180) / Math.PI, 10);
    expect(s.liftCoefficient).toBeCloseTo(-0.02, 12);
    // C_D on D = 0.89 at 0° (mean of 0.90, 0.89, 0.91 with zero-mean angles is 0.9); on B: × D/B = 3.6/27.5.
    expect(s.dragCoefficientOnB).toBeCloseTo((0.9 * 3.6) / 27.5, 12);
    expect(res.body.converted.rows[3].CD).toBeCloseTo((0.89 * 3.6) / 27.5, 12);
  });
});

describe("cross-section images", () => {
  const PNG_1X1 = Buffer.from(
    "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==",
    "base64",
  );
  const putImage = (name: string, bytes: Uint8Array, type: string) =>
    upload(base(), `/api/alternatives/${alternativeId}/image`, { cookie: analyst, method: "PUT", field: "image", file: { name, bytes, type } });

  it("stores a PNG and serves it back byte for byte", async () => {
    const res = await putImage("section.png", PNG_1X1, "image/png");
    expect(res.status).toBe(200);
    expect(res.body.image).toMatchObject({ contentType: "image/png", sizeBytes: PNG_1X1.length });
    const back = await fetch(`${base()}/api/alternatives/${alternativeId}/image`, { headers: { Cookie: analyst } });
    expect(back.headers.get("content-type")).toBe("image/png");
    expect(Buffer.from(await back.arrayBuffer()).equals(PNG_1X1)).toBe(true);
  });

  it.each([
    ["not-an-image.png", "image/png", /not a PNG, JPEG or SVG image/],
    ["svg-with-script.svg", "image/svg+xml", /contains scripts/],
  ])("refuses %s with 400 invalid_image and keeps the stored image", async (file, type, message) => {
    const before = await rowCounts(db);
    const res = await putImage(file, readFixture(`bad-uploads/${file}`), type);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("invalid_image");
    expect(res.body.error.message).toMatch(message);
    expect(await rowCounts(db)).toEqual(before);
    const alt = await api(base(), `/api/alternatives/${alternativeId}`, { cookie: analyst });
    expect(alt.body.image.contentType).toBe("image/png");
  });

  it("refuses a PNG sent as image/jpeg (content type and magic bytes disagree)", async () => {
    const res = await putImage("section.jpg", PNG_1X1, "image/jpeg");
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/sent as image\/jpeg but its content is image\/png/);
  });

  it("refuses an image over 5 MB with 413", async () => {
    const big = Buffer.concat([PNG_1X1, Buffer.alloc(5 * 1024 * 1024)]);
    const res = await putImage("big.png", big, "image/png");
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/5 MB limit/);
  });
});

describe("deleting a data set", () => {
  it("is refused while a stored revision takes its aerodynamics from it, and allowed for an unused one", async () => {
    const bytes = readFixture("uploads/flutter-derivatives.csv");
    const used = await uploadDataset("flutter-derivatives.csv", bytes, flutterMeta({ name: "Used set" }));
    const unused = await uploadDataset("flutter-derivatives.csv", bytes, flutterMeta({ name: "Unused set", meanAngleDeg: 3, convention: { abscissa: "Ur", normalisation: "2B", sign: "h-down" } }));
    expect([used.status, unused.status]).toEqual([201, 201]);

    // The workspace copies the data set's converted table into the study: save that as revision 2.
    const latest = await api(base(), `/api/studies/${studyId}/revisions`, { cookie: analyst });
    const top = latest.body[latest.body.length - 1];
    const revision = await api(base(), `/api/revisions/${top.id}`, { cookie: analyst });
    const study = { ...revision.body.study, aerodynamics: { model: "tabulated", interpolation: "linear", ...used.body.converted } };
    const saved = await api(base(), `/api/studies/${studyId}/revisions`, {
      cookie: analyst,
      body: { parentRevision: top.number, changeNote: "Derivatives from the used set", study },
    });
    expect(saved.status).toBe(201);

    const refused = await api(base(), `/api/datasets/${used.body.id}`, { cookie: analyst, method: "DELETE" });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("dataset_in_use");
    expect(refused.body.error.message).toContain(`r${saved.body.number} of “Test study”`);
    expect((await api(base(), `/api/datasets/${used.body.id}`, { cookie: analyst })).status).toBe(200);

    const removed = await api(base(), `/api/datasets/${unused.body.id}`, { cookie: analyst, method: "DELETE" });
    expect(removed.status).toBe(204);
  });
});
