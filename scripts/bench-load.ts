/**
 * Load benchmark against a running app: does one heavy sweep stall everyone else, and how large do answers get?
 *
 *   npm run bench:load                                   against http://127.0.0.1:$PORT (default 3000)
 *   npm run bench:load -- --base-url http://127.0.0.1:3102 --json
 *   npm run bench:load -- --write                        also saves a long revision (writes to the app's database)
 *
 * Signs in as the demo analyst (--email, --password), then:
 *   1. /api/health latency at rest (20 calls);
 *   2. a sweep that reaches the server's limit on solved speeds (a 10,000-row table, 20,001 grid speeds),
 *      with /api/health polled every 50 ms while it runs: every latency, the answer's status, size and time;
 *   3. the largest sweep under the limit (10,001 grid speeds, about 26,000 solved): answer size plain and gzip;
 *   4. with --write: that study saved as a revision in a new invented alternative of the first project the
 *      analyst may write, then read back (size, time) while /api/health is polled, and its full step table
 *      downloaded as CSV;
 *   5. in this process: the time JSON.stringify takes for the largest thinned answer (what the server does
 *      on its event loop for one answer).
 * Figures are printed (one JSON object per line with --json). Requests go to the given address only.
 */
import { request } from "node:http";
import { gzipSync } from "node:zlib";
import { denseTableDeck } from "../shared/engine/__tests__/support/extreme-deck";
import { runSweep } from "../shared/engine/run-sweep";
import { decimateResult } from "../server/lib/decimate-result";

const args = process.argv.slice(2);
const option = (name: string, fallback: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] ? args[i + 1] : fallback;
};
const baseUrl = option("base-url", `http://127.0.0.1:${process.env.PORT ?? 3000}`).replace(/\/+$/, "");
const email = option("email", "analyst@stillspan.test");
const password = option("password", "stillspan-demo");
const json = args.includes("--json");
const write = args.includes("--write");

interface Answer {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  bytes: Buffer;
  ms: number;
}

function call(path: string, options: { method?: string; body?: unknown; cookie?: string; gzip?: boolean } = {}): Promise<Answer> {
  const payload = options.body === undefined ? undefined : JSON.stringify(options.body);
  const headers: Record<string, string> = {};
  if (payload) headers["Content-Type"] = "application/json";
  if (options.cookie) headers.Cookie = options.cookie;
  if (options.gzip) headers["Accept-Encoding"] = "gzip";
  const started = performance.now();
  return new Promise((resolve, reject) => {
    const req = request(`${baseUrl}${path}`, { method: options.method ?? (payload ? "POST" : "GET"), headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, bytes: Buffer.concat(chunks), ms: performance.now() - started }));
      res.on("error", reject);
    });
    req.on("error", reject);
    req.end(payload);
  });
}

function report(name: string, figures: Record<string, unknown>): void {
  if (json) console.log(JSON.stringify({ name, ...figures }));
  else console.log(`${name.padEnd(28)} ${Object.entries(figures).map(([k, v]) => `${k} ${v}`).join("  ")}`);
}

const round = (v: number) => Number(v.toFixed(1));
function latencyFigures(ms: number[]) {
  const sorted = [...ms].sort((a, b) => a - b);
  const at = (q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
  return { calls: ms.length, medianMs: round(at(0.5)), p95Ms: round(at(0.95)), maxMs: round(sorted[sorted.length - 1] ?? 0), over500Ms: ms.filter((v) => v > 500).length };
}

/** Runs `work` while /api/health is called every 50 ms; returns its answer and the health latencies. */
async function underLoad<T>(work: () => Promise<T>): Promise<{ answer: T; health: number[] }> {
  let done = false;
  const running = work().finally(() => (done = true));
  const health: number[] = [];
  while (!done) {
    health.push((await call("/api/health")).ms);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  return { answer: await running, health };
}

async function main(): Promise<void> {
  const signIn = await call("/api/auth/sign-in", { body: { email, password } });
  const cookie = String(signIn.headers["set-cookie"]?.[0] ?? "").split(";")[0];
  if (signIn.status !== 200 || !cookie) throw new Error(`sign-in as ${email} at ${baseUrl} failed (${signIn.status})`);

  const rest: number[] = [];
  for (let i = 0; i < 20; i++) rest.push((await call("/api/health")).ms);
  report("health at rest", latencyFigures(rest));

  const atLimit = denseTableDeck(0.025);
  const heavy = await underLoad(() => call("/api/sweep", { body: atLimit, cookie }));
  report("sweep at the limit", { status: heavy.answer.status, seconds: round(heavy.answer.ms / 1000), answerBytes: heavy.answer.bytes.byteLength });
  report("health during that sweep", latencyFigures(heavy.health));

  const largest = denseTableDeck(0.05);
  const plain = await call("/api/sweep", { body: largest, cookie });
  const packed = await call("/api/sweep", { body: largest, cookie, gzip: true });
  const solved = plain.status === 200 ? (JSON.parse(plain.bytes.toString()) as { sampling?: { solvedSteps: number } }).sampling?.solvedSteps : undefined;
  report("largest sweep under limit", {
    status: plain.status,
    answerBytes: plain.bytes.byteLength,
    onWireGzipBytes: packed.headers["content-encoding"] === "gzip" ? packed.bytes.byteLength : "not compressed",
    solvedSteps: solved ?? "n/a",
  });

  if (write) await revisionFigures(cookie, largest);

  const full = runSweep(largest);
  const thinned = decimateResult(full);
  const time = (value: unknown) => {
    const started = performance.now();
    const text = JSON.stringify(value);
    return { ms: round(performance.now() - started), bytes: Buffer.byteLength(text), gzipBytes: gzipSync(text).byteLength };
  };
  const before = time(full);
  const after = time(thinned);
  report("stringify full result", { ms: before.ms, bytes: before.bytes, gzipBytes: before.gzipBytes });
  report("stringify thinned result", { ms: after.ms, bytes: after.bytes, gzipBytes: after.gzipBytes });
}

/** Saves `study` as a revision in a new invented alternative, reads it back under load, downloads its table. */
async function revisionFigures(cookie: string, study: ReturnType<typeof denseTableDeck>): Promise<void> {
  const projects = JSON.parse((await call("/api/projects", { cookie })).bytes.toString()) as { id: string }[];
  if (projects.length === 0) throw new Error("--write: the analyst is in no project");
  const alternative = await call(`/api/projects/${projects[0].id}/alternatives`, {
    cookie,
    body: { name: `Load bench ${new Date().toISOString()} (invented)`, deckWidthM: 1000, deckDepthM: 3 },
  });
  const alternativeId = (JSON.parse(alternative.bytes.toString()) as { id: string }).id;
  const created = await call(`/api/alternatives/${alternativeId}/studies`, {
    cookie,
    body: { name: "Load bench study (invented)", purpose: "npm run bench:load", study },
  });
  if (created.status !== 201) throw new Error(`--write: the study was not created (${created.status}: ${created.bytes.toString().slice(0, 300)})`);
  const revisionId = (JSON.parse(created.bytes.toString()) as { latestRevision: { id: string } }).latestRevision.id;
  report("save long revision", { status: created.status, seconds: round(created.ms / 1000) });
  const read = await underLoad(() => call(`/api/revisions/${revisionId}`, { cookie }));
  report("read long revision", { status: read.answer.status, ms: round(read.answer.ms), answerBytes: read.answer.bytes.byteLength });
  report("health during read", latencyFigures(read.health));
  const csv = await underLoad(() => call(`/api/revisions/${revisionId}/steps.csv`, { cookie }));
  report("full table CSV download", { status: csv.answer.status, ms: round(csv.answer.ms), bytes: csv.answer.bytes.byteLength });
  report("health during download", latencyFigures(csv.health));
}

main().catch((err: unknown) => {
  console.error(`bench:load: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
