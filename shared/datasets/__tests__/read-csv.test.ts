import { describe, expect, it } from "vitest";
import { fitStaticSlopes } from "../fit-static-slopes";
import { readFlutterDerivativesCsv } from "../read-flutter-derivatives-csv";
import { readStaticCoefficientsCsv } from "../read-static-coefficients-csv";
import { readNumber } from "../read-csv-table";

const utf8 = (text: string) => new TextEncoder().encode(text);

describe("readNumber", () => {
  it.each([
    ["1.5", 1.5],
    ["-0.25", -0.25],
    ["+3", 3],
    [".5", 0.5],
    ["1e-3", 0.001],
    ["2.E+2", 200],
  ])("reads %s as %d", (cell, value) => {
    expect(readNumber(cell)).toEqual({ ok: true, value });
  });

  it.each([
    ["", /is empty/],
    ["abc", /"abc" is not a number/],
    ["0,25", /decimal comma\? use a point/],
    ["NaN", /is NaN: only finite numbers/],
    ["-inf", /is -inf: only finite numbers/],
    ["1e999", /out of the range/],
    ["0x10", /is not a number/],
    ["1e-320", /"1e-320" is a denormal number/],
  ])("refuses %j", (cell, message) => {
    const read = readNumber(cell);
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.message).toMatch(message);
  });
});

describe("readFlutterDerivativesCsv", () => {
  it("accepts a K abscissa column for the K convention, names in any case and with a trailing asterisk", () => {
    const read = readFlutterDerivativesCsv(utf8("K,h1*,A2*\n0.5,-1,-0.1\n1.0,-0.5,-0.05\n"), "K");
    expect(read.ok).toBe(true);
    if (read.ok) {
      expect(read.delivered.abscissa).toEqual([0.5, 1]);
      expect(read.delivered.H1).toEqual([-1, -0.5]);
      expect(read.delivered.A3).toEqual([0, 0]);
    }
  });

  it("accepts K in decreasing order (sorted by Ur) but not a K column that turns back", () => {
    expect(readFlutterDerivativesCsv(utf8("K,H1\n1.5,-0.4\n1.0,-0.5\n0.5,-1\n"), "K").ok).toBe(true);
    const read = readFlutterDerivativesCsv(utf8("K,H1\n1.5,-0.4\n1.0,-0.5\n1.2,-1\n"), "K");
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(read.issues).toEqual([
        { row: 4, column: "K", message: "1.2 is larger than 1 on line 3: reduced frequency (K) must decrease strictly from row to row (in one direction throughout)" },
      ]);
    }
  });

  it("refuses a Ur column when the convention's abscissa is K", () => {
    const read = readFlutterDerivativesCsv(utf8("Ur,H1\n2,-1\n4,-2\n"), "k-half");
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.issues[0]).toMatchObject({ row: 1, column: "Ur", message: expect.stringMatching(/abscissa "K"/) });
  });

  it("counts blank lines in the line numbers it reports", () => {
    const read = readFlutterDerivativesCsv(utf8("Ur,H1\n\n2,-1\n\n4,oops\n"), "Ur");
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.issues).toEqual([{ row: 5, column: "H1", message: '"oops" is not a number' }]);
  });

  it("refuses a zero or negative abscissa", () => {
    const read = readFlutterDerivativesCsv(utf8("Ur,H1\n0,-1\n4,-2\n"), "Ur");
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.issues[0]).toMatchObject({ row: 2, column: "Ur", message: "0 must be greater than 0" });
  });
});

describe("fitStaticSlopes", () => {
  it("recovers the line of exactly linear data (closed form: a straight line is its own least-squares fit)", () => {
    const rows = [-4, -2, 0, 2, 4, 8].map((a) => ({ angleDeg: a, CD: 0.1 + 0.002 * a, CL: -0.05 + 0.09 * a, CM: 0.01 + 0.02 * a }));
    const fit = fitStaticSlopes(rows, { fromDeg: -4, toDeg: 4 });
    expect(fit.ok).toBe(true);
    if (fit.ok) {
      const perRad = 180 / Math.PI;
      expect(fit.slopes.pointCount).toBe(5);
      expect(fit.slopes.liftSlopePerRad).toBeCloseTo(0.09 * perRad, 12);
      expect(fit.slopes.momentSlopePerRad).toBeCloseTo(0.02 * perRad, 12);
      expect(fit.slopes.dragCoefficientOnB).toBeCloseTo(0.1, 12);
      expect(fit.slopes.liftCoefficient).toBeCloseTo(-0.05, 12);
    }
  });

  it("needs two rows in the window", () => {
    expect(fitStaticSlopes([{ angleDeg: 0, CD: 1, CL: 0, CM: 0 }, { angleDeg: 5, CD: 1, CL: 0, CM: 0 }], { fromDeg: -1, toDeg: 1 })).toEqual({
      ok: false,
      pointCount: 1,
    });
  });
});

describe("files that once crashed the reader or echoed themselves", () => {
  it("a file of only commas is refused with the line and column, not a crash", () => {
    for (const text of [",,,,,,,,\n,,,,,,,,\n", ",\n\n,,\n", ",,,"]) {
      const read = readFlutterDerivativesCsv(utf8(text), "Ur");
      expect(read.ok, JSON.stringify(text)).toBe(false);
      if (!read.ok) expect(read.issues).toEqual([{ row: 1, column: "column 1", message: expect.stringMatching(/no column names: the file holds only commas/) }]);
    }
    expect(readStaticCoefficientsCsv(utf8(",,,\n")).ok).toBe(false);
  });

  it("a K file of 125,000 rows (under 1 MB) is refused with the row limit and the first line past it", () => {
    const rows = Array.from({ length: 125_000 }, (_, i) => `${(125_000 - i) / 1000}`);
    const bytes = utf8(`K\n${rows.join("\n")}\n`);
    expect(bytes.length).toBeLessThan(1024 * 1024);
    const read = readFlutterDerivativesCsv(bytes, "K");
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(read.issues).toEqual([
        { row: 10_002, message: "The file has 125000 data rows; at most 10000 are accepted (line 10002 is row 10001)." },
      ]);
    }
  });

  it("a table at the row limit is read", () => {
    const rows = Array.from({ length: 10_000 }, (_, i) => `${1 + i / 100},${-i / 1000}`);
    const read = readFlutterDerivativesCsv(utf8(`Ur,H1\n${rows.join("\n")}\n`), "Ur");
    expect(read.ok).toBe(true);
    if (read.ok) expect(read.delivered.abscissa).toHaveLength(10_000);
  });

  it("a 1 MB header cell is quoted to 100 characters, in the message and in the column", () => {
    const cell = "Z".repeat(1024 * 1024);
    const read = readFlutterDerivativesCsv(utf8(`Ur,${cell}\n1,2\n2,3\n`), "Ur");
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(JSON.stringify(read.issues).length).toBeLessThan(1000);
      expect(read.issues[0].message).toMatch(/^"Z{100}…" \(1048576 characters\) is not a known column/);
      expect(read.issues[0].column).toHaveLength(100);
    }
  });

  it("a long bad number is quoted to 100 characters", () => {
    const read = readNumber("9".repeat(400) + "x");
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.message.length).toBeLessThan(160);
  });

  it("a header of 200,000 unknown columns lists 50 problems and counts the rest", () => {
    const read = readFlutterDerivativesCsv(utf8(`Ur,${Array.from({ length: 200_000 }, (_, i) => `c${i}`).join(",")}\n`), "Ur");
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(read.issues).toHaveLength(51);
      expect(read.issues[50]).toEqual({ message: "… and 199950 more problems." });
    }
  });
});
