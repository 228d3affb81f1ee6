import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { sweepResultSchema } from "../../../shared/schemas/result";
import { benchmarkDeck } from "../../../shared/engine/__tests__/support/benchmark-deck";

const root = path.resolve(__dirname, "../../..");
const dir = mkdtempSync(path.join(tmpdir(), "stillspan-sweep-cli-"));

function cli(...args: string[]) {
  const run = spawnSync(process.execPath, ["--import", "tsx", path.join(root, "server/cli/sweep.ts"), ...args], {
    cwd: root,
    encoding: "utf8",
  });
  return { code: run.status, stdout: run.stdout, stderr: run.stderr };
}

/** Benchmark deck inputs of docs/conventions.md §Benchmark deck (IABSE TG 3.1), flat plate, 1–150 m/s at 0.5 m/s. */
const study = benchmarkDeck();

describe("npm run sweep (server/cli/sweep.ts)", () => {
  it("prints the result JSON of a valid study, with --from/--to/--step overriding the sweep", () => {
    const file = path.join(dir, "deck.json");
    writeFileSync(file, JSON.stringify(study));
    const run = cli(file, "--from", "60", "--to", "90", "--step", "2");
    expect(run.code, run.stderr).toBe(0);
    const result = sweepResultSchema.parse(JSON.parse(run.stdout));
    expect(result.modes[0].steps.map((s) => s.speed)).toEqual(Array.from({ length: 16 }, (_, i) => 60 + 2 * i));
    expect(Math.abs(result.flutter!.speed - 77.24) / 77.24).toBeLessThan(1e-3); // docs/conventions.md §Benchmark deck, computed
    // Thin-plate theory has no table: the flutter point says so (null), it is not left out of the JSON.
    expect(JSON.parse(run.stdout).flutter.insideTestedRange).toBeNull();
    // The closed-form divergence 90.47 m/s (docs/conventions.md §Benchmark deck) lies beyond this 60–90 m/s sweep.
    expect(result.divergence).toBeNull();
    expect(Math.abs(result.divergenceOutsideSweep!.speed - 90.47) / 90.47).toBeLessThan(1e-3);
  });

  it("rejects a bad file with one stderr line per field (JSON path and rule), exit code 2 and empty stdout", () => {
    const bad = structuredClone(study) as Record<string, any>;
    bad.structure.modes[1].frequency = -1;
    bad.sweep.extra = true;
    const file = path.join(dir, "bad.json");
    writeFileSync(file, JSON.stringify(bad));
    const run = cli(file, "--step", "0");
    expect(run.code).toBe(2);
    expect(run.stdout).toBe("");
    expect(run.stderr).toContain("$.structure.modes[1].frequency: must be greater than 0");
    expect(run.stderr).toContain("$.sweep.extra: is not a field of this format");
    expect(run.stderr).toContain("$.sweep.step: must be greater than 0");
  });
});
