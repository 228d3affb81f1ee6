import { gunzipSync } from "node:zlib";
import { afterEach, describe, expect, it } from "vitest";
import { SweepStepLimitError } from "../../../shared/engine/core/step-limit-error.js";
import { benchmarkDeck } from "../../../shared/engine/__tests__/support/benchmark-deck.js";
import { denseTableDeck, extremeDeck } from "../../../shared/engine/__tests__/support/extreme-deck.js";
import { parseStudy, type StudyDocument } from "../../../shared/schemas/study.js";
import { AppError } from "../../errors.js";
import { computeSweep } from "../sweep-compute.js";
import { SweepPool, type SweepPoolSettings } from "../sweep-pool.js";

function valid(doc: StudyDocument): StudyDocument {
  const parsed = parseStudy(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.study;
}
const study = (sweep: { from: number; to: number; step: number }) => valid(benchmarkDeck(sweep));
/** About 26,000 solved speeds over a 10,000-row table: 2–4 s of computing on this kind of machine. */
const long = () => valid(denseTableDeck(0.05));
const small = () => study({ from: 10, to: 100, step: 1 });

const defaults: SweepPoolSettings = { workers: 1, computeLimitMs: 60_000, queueLimit: 8, queuePerUser: 8, maxWaitMs: 60_000, maxSolvedSteps: 1_000_000 };
const pools: SweepPool[] = [];
function pool(settings: Partial<SweepPoolSettings> = {}): SweepPool {
  const p = new SweepPool({ ...defaults, ...settings });
  pools.push(p);
  return p;
}
afterEach(async () => {
  await Promise.all(pools.splice(0).map((p) => p.close()));
});

const request = (owner = "1", signal?: AbortSignal) => ({ owner, signal, table: false });
const failure = (promise: Promise<unknown>) => promise.then(() => { throw new Error("expected a failure"); }, (err: unknown) => err as AppError);

describe("sweep worker pool", () => {
  it("returns what computeSweep gives in-process, full step table included (IABSE TG 3.1 inputs, docs/conventions.md §Benchmark deck: 77.24 m/s)", async () => {
    const doc = small();
    const pooled = await pool().run(doc, { owner: "1", table: true });
    const local = computeSweep(doc, { table: true });
    expect(pooled.result).toEqual(local.result);
    expect(Math.abs(pooled.result.flutter!.speed - 77.24) / 77.24).toBeLessThan(1e-3);
    expect(Buffer.isBuffer(pooled.table!.gzip)).toBe(true);
    expect(gunzipSync(pooled.table!.gzip).toString()).toBe(gunzipSync(local.table!.gzip).toString());
  }, 30_000);

  it("keeps the calling thread free while a sweep runs: timers fire before the sweep answers", async () => {
    let ticks = 0;
    const timer = setInterval(() => ticks++, 1);
    let ticksWhenDone = -1;
    const done = pool().run(study({ from: 0, to: 400, step: 0.02 }), request()).then((r) => {
      ticksWhenDone = ticks;
      return r;
    });
    await new Promise((resolve) => setTimeout(resolve, 50));
    const ticksAt50ms = ticks;
    const computed = await done;
    clearInterval(timer);
    expect(ticksAt50ms).toBeGreaterThan(0);
    expect(ticksWhenDone).toBeGreaterThan(0);
    expect(computed.result.sampling!.solvedSteps).toBeGreaterThanOrEqual(20_001);
  }, 60_000);

  it("stops a sweep over its compute limit with a 422 naming the limit, then keeps working", async () => {
    const p = pool({ computeLimitMs: 5 });
    const err = await failure(p.run(long(), request()));
    expect(err).toBeInstanceOf(AppError);
    expect([err.status, err.code]).toEqual([422, "sweep_timeout"]);
    expect(err.message).toContain("time limit of 5 ms");
    const slow = pool({ computeLimitMs: 60_000 });
    expect((await slow.run(small(), request())).result.flutter).not.toBeNull();
  }, 60_000);

  it("counts the compute limit in the worker's CPU time: six sweeps sharing two cores all finish", async () => {
    // Alone, a sweep's wall time is its CPU time. Six at once on this 2-core machine take about three times as
    // long each by the wall clock, but no more CPU: a limit of 2.5 × the lone time stops none of them.
    // A sweep of seconds, so that the workers' start-up and compilation are small beside it.
    const doc = long();
    const warm = pool({ workers: 6 });
    await warm.run(small(), request());
    const started = performance.now();
    await warm.run(doc, request());
    const aloneMs = performance.now() - started;
    const shared = pool({ workers: 6, computeLimitMs: Math.ceil(2.5 * aloneMs) });
    await Promise.all(Array.from({ length: 6 }, (_, i) => shared.run(small(), request(`warm-${i}`))));
    const outcomes = await Promise.allSettled(Array.from({ length: 6 }, (_, i) => shared.run(doc, request(`u${i}`))));
    expect(outcomes.map((o) => o.status)).toEqual(Array(6).fill("fulfilled"));
  }, 120_000);

  it("does not count the wait in the queue against the compute limit", async () => {
    const p = pool({ workers: 1 });
    await p.run(small(), request());
    const started = performance.now();
    await p.run(long(), request());
    const aloneMs = performance.now() - started;
    // Each sweep has 1.6 × its lone time to compute; the second waits about one sweep before it starts.
    const limited = pool({ workers: 1, computeLimitMs: Math.ceil(1.6 * aloneMs) });
    await limited.run(small(), request());
    const both = await Promise.allSettled([limited.run(long(), request("a")), limited.run(long(), request("b"))]);
    expect(both.map((o) => o.status)).toEqual(["fulfilled", "fulfilled"]);
  }, 120_000);

  it("drops a waiting sweep when its request is closed, and stops a running one's worker", async () => {
    const p = pool({ workers: 1 });
    await p.run(small(), request()); // the worker is up
    const running = new AbortController();
    const waiting = new AbortController();
    const first = failure(p.run(long(), request("1", running.signal)));
    const second = failure(p.run(long(), request("2", waiting.signal)));
    const third = p.run(small(), request("3"));
    await new Promise((resolve) => setTimeout(resolve, 200));
    waiting.abort();
    expect((await second).code).toBe("cancelled");
    expect(p.stats().waiting).toBe(1);
    running.abort();
    expect((await first).code).toBe("cancelled");
    // The abandoned sweeps are not computed: the small one runs next, on a fresh worker.
    expect((await third).result.flutter).not.toBeNull();
    expect(p.stats()).toMatchObject({ running: 0, waiting: 0 });
  }, 60_000);

  it("bounds the queue in all and per user with 429 busy and a Retry-After", async () => {
    const p = pool({ workers: 1, queueLimit: 1, queuePerUser: 2 });
    const running = p.run(long(), request("a"));
    const queued = p.run(small(), request("a"));
    const mine = await failure(p.run(small(), request("a")));
    expect([mine.status, mine.code, (mine.details as { reason: string }).reason]).toEqual([429, "busy", "user"]);
    expect(mine.retryAfterS).toBeGreaterThanOrEqual(1);
    const full = await failure(p.run(small(), request("b")));
    expect([full.status, full.code, (full.details as { reason: string }).reason]).toEqual([429, "busy", "queue"]);
    expect(full.message).toContain("1 sweep is already waiting");
    await Promise.all([running, queued]);
  }, 60_000);

  it("refuses a sweep that waited too long, and one whose estimated wait is too long", async () => {
    const p = pool({ workers: 1, maxWaitMs: 300 });
    // Until the worker is up (its start-up can outlast the 300 ms): the waits below are the queue's own.
    for (let tries = 0; !(await p.run(small(), request("a")).then(() => true, () => false)) && tries < 20; tries++);
    const running = p.run(long(), request("a"));
    const waited = await failure(p.run(small(), request("b")));
    expect([waited.code, (waited.details as { reason: string }).reason]).toEqual(["busy", "waited"]);
    await running; // the pool now knows a sweep takes longer than 300 ms
    const again = p.run(long(), request("a"));
    const estimated = await failure(p.run(small(), request("b")));
    expect((estimated.details as { reason: string }).reason).toBe("estimate");
    expect(estimated.message).toMatch(/wait for a free worker would be about .* longer than the limit of 300 ms/);
    await again;
  }, 60_000);

  it("passes the limit on solved speeds to the engine", async () => {
    const err = await pool({ maxSolvedSteps: 2500 }).run(valid(extremeDeck()), request()).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(SweepStepLimitError);
    expect((err as SweepStepLimitError).limit).toBe(2500);
  }, 30_000);

  it("on close fails waiting and running sweeps with 503 and refuses new ones", async () => {
    const p = new SweepPool({ ...defaults, workers: 1 });
    const running = failure(p.run(long(), request("a")));
    const waiting = failure(p.run(small(), request("b")));
    await new Promise((resolve) => setTimeout(resolve, 100));
    await p.close();
    expect((await running).code).toBe("shutting_down");
    expect((await waiting).code).toBe("shutting_down");
    expect((await failure(p.run(small(), request("c")))).status).toBe(503);
    expect(p.stats()).toEqual({ workers: 0, running: 0, waiting: 0 });
  }, 30_000);
});
