/**
 * Engine benchmark: median time of one whole sweep (tracking, local refinement and critical-speed search
 * included) after a warm-up, for the two reference cases of docs/method-and-validation.md.
 *
 *   npm run bench              readable table
 *   npm run bench -- --json    one JSON object per line per case
 *   npm run bench -- --runs 30 more runs (default 20, the minimum)
 *
 * Times are wall-clock medians; the table also shows the median process CPU time, which tells a busy machine
 * (wall ≫ CPU) from a slow sweep.
 */
import { createAeroModel } from "../shared/engine/aero/create-aero-model";
import { locateFlutter, locateStaticCrossing } from "../shared/engine/core/locate-critical";
import { trackPoles } from "../shared/engine/core/track-poles";
import { generalizedSystem, type GeneralizedModeInput } from "../shared/engine/generalized";
import { runSweep } from "../shared/engine/run-sweep";
import { sweepGrid } from "../shared/engine/sweep-grid";
import { benchmarkDeck } from "../shared/engine/__tests__/support/benchmark-deck";
import type { StudyDocument } from "../shared/schemas/study";

interface BenchCase {
  name: string;
  /** Runs one sweep; returns the number of solved speeds and of tracked modes. */
  run(): { solvedSpeeds: number; modes: number };
  speeds: number;
}

/** Benchmark deck of docs/conventions.md §Benchmark deck (IABSE TG 3.1 inputs), flat plate, 1–150 m/s at 0.25 m/s. */
const sectionDeck: StudyDocument = benchmarkDeck({ step: 0.25 });

const grid = sweepGrid(1, 150, 0.25);

/** 10 vertical + 10 torsional modes sin(kπx/ℓ) of a 1000 m span, same deck, flat plate: a 40×40 state. */
function generalized20(): BenchCase {
  const span = 1000;
  const stations = Float64Array.from({ length: 201 }, (_, i) => (i * span) / 200);
  const shape = (k: number) => Float64Array.from(stations, (x) => Math.sin((k * Math.PI * x) / span));
  const zero = new Float64Array(stations.length);
  const modes: GeneralizedModeInput[] = [];
  for (let k = 1; k <= 10; k++) {
    modes.push({ id: `V${k}`, frequencyHz: 0.1 + 0.03 * (k - 1), damping: 0.003, heave: shape(k), torsion: zero });
  }
  for (let k = 1; k <= 10; k++) {
    modes.push({ id: `T${k}`, frequencyHz: 0.278 + 0.035 * (k - 1), damping: 0.003, heave: zero, torsion: shape(k) });
  }
  return {
    name: "generalized-20",
    speeds: grid.length,
    run() {
      const system = generalizedSystem({
        stationsM: stations,
        widthM: 31,
        massKgPerM: 22740,
        inertiaKgM2PerM: 2.47e6,
        densityKgM3: 1.22,
        modes,
        aero: createAeroModel({ model: "flat-plate" }),
      });
      const track = trackPoles(system, grid);
      locateFlutter(system, track);
      locateStaticCrossing(system, track);
      return { solvedSpeeds: track.branches[0].length, modes: system.size };
    },
  };
}

const cases: BenchCase[] = [
  {
    name: "section-2dof",
    speeds: grid.length,
    run() {
      const result = runSweep(sectionDeck);
      return { solvedSpeeds: result.modes[0].steps.length, modes: result.modes.length };
    },
  },
  generalized20(),
];

const args = process.argv.slice(2);
const json = args.includes("--json");
const runsArg = args.indexOf("--runs");
const runs = Math.max(20, runsArg >= 0 ? Number(args[runsArg + 1]) || 20 : 20);

for (const c of cases) {
  // warm-up until the JIT has settled: at least 3 runs and 2 s (at most 200 runs)
  let info = c.run();
  const warmStart = performance.now();
  for (let i = 1; i < 200 && (i < 3 || performance.now() - warmStart < 2000); i++) info = c.run();
  const times: number[] = [];
  const cpuTimes: number[] = [];
  for (let i = 0; i < runs; i++) {
    const cpu0 = process.cpuUsage();
    const t0 = performance.now();
    info = c.run();
    times.push(performance.now() - t0);
    const cpu = process.cpuUsage(cpu0);
    cpuTimes.push((cpu.user + cpu.system) / 1000);
  }
  const median = medianOf(times);
  const line = {
    name: c.name,
    msPerSweep: Number(median.toFixed(3)),
    sweepsPerSecond: Number((1000 / median).toFixed(2)),
    speeds: c.speeds,
    solvedSpeeds: info.solvedSpeeds,
    modes: info.modes,
    runs,
  };
  if (json) console.log(JSON.stringify(line));
  else {
    console.log(
      `${c.name.padEnd(16)} ${line.msPerSweep.toFixed(3).padStart(10)} ms/sweep  ${line.sweepsPerSecond.toFixed(2).padStart(9)} sweeps/s  ` +
        `${line.speeds} grid speeds, ${line.solvedSpeeds} solved, ${line.modes} modes, median of ${runs} runs ` +
        `(process CPU time ${medianOf(cpuTimes).toFixed(3)} ms per sweep)`,
    );
  }
}

function medianOf(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}
