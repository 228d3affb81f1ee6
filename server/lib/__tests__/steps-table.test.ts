import { Readable } from "node:stream";
import { text } from "node:stream/consumers";
import { describe, expect, it } from "vitest";
import { benchmarkDeck } from "../../../shared/engine/__tests__/support/benchmark-deck.js";
import { runSweep } from "../../../shared/engine/run-sweep.js";
import { stepsCsvChunks, stepsCsvToJson } from "../steps-table.js";

const result = runSweep(benchmarkDeck({ from: 60, to: 90, step: 2 }));

/** The CSV cut into pieces of `size` characters, so rows and numbers are split across chunks. */
function pieces(csv: string, size: number): Readable {
  return Readable.from(Array.from({ length: Math.ceil(csv.length / size) }, (_, i) => csv.slice(i * size, (i + 1) * size)));
}

describe("full step table as CSV", () => {
  it("has one row per solved step of every branch, branch by branch in speed order, SI units in the header", () => {
    const lines = Array.from(stepsCsvChunks(result, 7)).join("").trimEnd().split("\r\n");
    const total = result.modes.reduce((n, m) => n + m.steps.length, 0);
    expect(lines[0]).toBe("branch,speed_m_s,frequency_hz,damping_ratio,re_rad_s,im_rad_s,participation_V1,participation_T1,mac,confidence");
    expect(lines).toHaveLength(total + 1);
    const first = result.modes[0].steps[0];
    expect(lines[1]).toBe(["V1", first.speed, first.frequency, first.damping, first.re, first.im, first.participation.V1, first.participation.T1, first.mac, first.confidence].join(","));
    expect(lines[result.modes[0].steps.length + 1].startsWith("T1,60,")).toBe(true);
  });

  it("quotes a branch id holding a comma or a quote (RFC 4180)", () => {
    const odd = { modes: [{ id: 'deck "A", heave', steps: result.modes[0].steps.slice(0, 1) }] };
    const csv = Array.from(stepsCsvChunks(odd)).join("");
    expect(csv.split("\r\n")[1].startsWith('"deck ""A"", heave",')).toBe(true);
  });
});

describe("full step table as JSON, made from the CSV stream", () => {
  it.each([1, 13, 4096])("gives back every step with the engine's exact numbers (CSV in pieces of %i characters)", async (size) => {
    const csv = Array.from(stepsCsvChunks(result)).join("");
    const json = JSON.parse(await text(pieces(csv, size).pipe(stepsCsvToJson(["V1", "T1"], result.engine))));
    expect(json).toEqual({ engine: result.engine, modes: result.modes });
  });

  it("names branches from the ids given, also ids the CSV had to quote", async () => {
    const ids = ['deck "A", heave', "T,1"];
    const odd = { modes: result.modes.map((m, j) => ({ id: ids[j], steps: m.steps.map((s) => ({ ...s, participation: { [ids[0]]: s.participation.V1, [ids[1]]: s.participation.T1 } })) })) };
    const csv = Array.from(stepsCsvChunks(odd)).join("");
    const json = JSON.parse(await text(pieces(csv, 50).pipe(stepsCsvToJson(ids, "e"))));
    expect(json.modes).toEqual(odd.modes);
  });

  it("is an empty list for a table without rows", async () => {
    const json = JSON.parse(await text(Readable.from(["branch,speed_m_s\r\n"]).pipe(stepsCsvToJson([], "e"))));
    expect(json).toEqual({ engine: "e", modes: [] });
  });
});
