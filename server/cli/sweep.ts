/**
 * `npm run --silent sweep -- study.json [--table] [--from U] [--to U] [--step dU]`
 *
 * Runs the stability sweep of a `stillspan.study/1` file. Prints the result JSON on stdout (or a readable table
 * with --table). A bad file prints one line per problem on stderr — the JSON path of the value and the rule it
 * broke — and exits with code 2, printing nothing on stdout. Results are indicative: critical cases need
 * wind-tunnel verification and review by a licensed engineer under local codes and standards.
 */
import { readFileSync } from "node:fs";
import { runSweep } from "../../shared/engine/run-sweep.js";
import type { SweepResult } from "../../shared/schemas/result.js";
import { parseStudy } from "../../shared/schemas/study.js";

const USAGE = "usage: npm run --silent sweep -- study.json [--table] [--from U] [--to U] [--step dU]   (speeds in m/s)";

class UsageError extends Error {}

interface Args {
  file: string;
  table: boolean;
  overrides: { from?: number; to?: number; step?: number };
}

function parseArgs(argv: string[]): Args {
  let file: string | undefined;
  let table = false;
  const overrides: Args["overrides"] = {};
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === "--table") table = true;
    else if (arg === "--from" || arg === "--to" || arg === "--step") {
      const raw = argv[++i];
      const value = Number(raw);
      if (raw === undefined || raw.trim() === "" || !Number.isFinite(value)) {
        throw new UsageError(`${arg} needs a number in m/s (got ${raw ?? "nothing"})`);
      }
      overrides[arg.slice(2) as "from" | "to" | "step"] = value;
    } else if (arg.startsWith("--")) throw new UsageError(`unknown option ${arg}`);
    else if (file === undefined) file = arg;
    else throw new UsageError(`only one study file, got also ${arg}`);
  }
  if (file === undefined) throw new UsageError("no study file given");
  return { file, table, overrides };
}

function formatTable(result: SweepResult): string {
  const lines: string[] = [];
  const f = result.flutter;
  lines.push(
    f
      ? `Flutter      ${f.speed.toFixed(3)} m/s at ${f.frequency.toFixed(4)} Hz, branch ${f.mode}, ${f.kind}, Ur = ${f.reducedVelocity.toFixed(2)}` +
          (f.insideTestedRange === true ? ", within the tested range" : f.insideTestedRange === false ? ", beyond the tested range" : "")
      : "Flutter      none in the range",
  );
  const outside = result.divergenceOutsideSweep;
  lines.push(
    `Divergence   ${result.divergence ? `${result.divergence.speed.toFixed(2)} m/s (closed form)` : outside ? `${outside.speed.toFixed(2)} m/s (closed form, outside the sweep)` : "none (closed form)"}`,
  );
  lines.push(`Selberg      ${result.selberg === null ? "n/a" : `${result.selberg.toFixed(2)} m/s`}`);
  for (const w of result.warnings) lines.push(`Warning      [${w.code}] ${w.message}`);
  lines.push("");
  const header = ["U m/s".padStart(9), ...result.modes.map((m) => `${m.id} f Hz`.padStart(11) + `${m.id} ζ %`.padStart(11))];
  lines.push(header.join(""));
  const rows = result.modes[0]?.steps.length ?? 0;
  for (let k = 0; k < rows; k++) {
    const cells = [result.modes[0].steps[k].speed.toFixed(3).padStart(9)];
    for (const m of result.modes) {
      const s = m.steps[k];
      cells.push(s.frequency.toFixed(4).padStart(11) + (100 * s.damping).toFixed(3).padStart(11));
    }
    lines.push(cells.join(""));
  }
  lines.push("");
  lines.push("Results are indicative; critical cases need wind-tunnel verification and review by a licensed engineer.");
  return lines.join("\n");
}

function main(): number {
  let args: Args;
  try {
    args = parseArgs(process.argv.slice(2));
  } catch (err) {
    if (err instanceof UsageError) {
      process.stderr.write(`${err.message}\n${USAGE}\n`);
      return 2;
    }
    throw err;
  }
  let text: string;
  try {
    text = readFileSync(args.file, "utf8");
  } catch (err) {
    process.stderr.write(`${args.file}: cannot read the file (${(err as NodeJS.ErrnoException).code ?? String(err)})\n`);
    return 2;
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (err) {
    process.stderr.write(`${args.file}: not valid JSON (${(err as Error).message})\n`);
    return 2;
  }
  // overrides go into the document so that they are checked by the same rules, with the same paths
  if (json !== null && typeof json === "object" && !Array.isArray(json) && Object.keys(args.overrides).length > 0) {
    const doc = json as Record<string, unknown>;
    const sweep = doc.sweep !== null && typeof doc.sweep === "object" ? (doc.sweep as Record<string, unknown>) : {};
    doc.sweep = { ...sweep, ...args.overrides };
  }
  const parsed = parseStudy(json);
  if (!parsed.ok) {
    for (const issue of parsed.issues) process.stderr.write(`${args.file}: ${issue.path}: ${issue.message}\n`);
    return 2;
  }
  const result = runSweep(parsed.study);
  process.stdout.write(args.table ? `${formatTable(result)}\n` : `${JSON.stringify(result)}\n`);
  return 0;
}

// a closed pipe (`… | head`) is not an error of the sweep
process.stdout.on("error", (err: NodeJS.ErrnoException) => {
  if (err.code === "EPIPE") process.exit(process.exitCode ?? 0);
  throw err;
});
process.exitCode = main();
