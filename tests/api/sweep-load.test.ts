/**
 * The server under load from sweeps: abandoned sweeps are dropped, the queue is bounded (429 busy with
 * Retry-After), and a slow request body is cut off. Each test starts an app of its own with small limits.
 */
import net from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { benchmarkDeck } from "../../shared/engine/__tests__/support/benchmark-deck.js";
import { denseTableDeck } from "../../shared/engine/__tests__/support/extreme-deck.js";
import { APP_CONTEXT_KEY, type AppContext } from "../../server/app-context.js";
import { startTestApp, type TestApp } from "../support/app.js";
import { createProjectWithMembers, openTestDb } from "../support/db.js";
import { api, signIn } from "../support/http.js";

const db = openTestDb();
/** About 26,000 solved speeds over a 10,000-row table: seconds of computing. */
const long = () => denseTableDeck(0.05);
const small = () => benchmarkDeck({ from: 10, to: 100, step: 1 });

beforeAll(async () => {
  await createProjectWithMembers(db, `Sweep load test ${Date.now().toString(36)}`, { "analyst@stillspan.test": "analyst" });
});
afterAll(() => db.$client.end());

async function withApp(env: Record<string, string>, run: (app: TestApp, cookie: string) => Promise<void>): Promise<void> {
  const app = await startTestApp({ env });
  try {
    await run(app, await signIn(app.baseUrl, "analyst@stillspan.test"));
  } finally {
    await app.close();
  }
}

const sweepsOf = (app: TestApp) => (app.app.locals[APP_CONTEXT_KEY] as AppContext).sweeps;

async function until(condition: () => boolean, timeoutMs: number): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (!condition() && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 50));
  return condition();
}

describe("sweeps under load", () => {
  it("drops the sweeps of clients that disconnected, waiting or running, so the next sweep does not wait for them", async () => {
    await withApp({ STILLSPAN_SWEEP_WORKERS: "2", STILLSPAN_SWEEP_QUEUE_PER_USER: "20", STILLSPAN_SWEEP_QUEUE: "20" }, async (app, cookie) => {
      expect((await api(app.baseUrl, "/api/sweep", { cookie, body: small() })).status).toBe(200); // workers up
      const clients = Array.from({ length: 8 }, () => new AbortController());
      const abandoned = clients.map((c) =>
        fetch(`${app.baseUrl}/api/sweep`, { method: "POST", headers: { "Content-Type": "application/json", Cookie: cookie }, body: JSON.stringify(long()), signal: c.signal }).catch(() => null),
      );
      expect(await until(() => sweepsOf(app).stats().running === 2, 5000)).toBe(true);
      expect(sweepsOf(app).stats().waiting).toBe(6);
      for (const c of clients) c.abort();
      await Promise.all(abandoned);
      // Computed to the end, the eight would keep both workers busy for several seconds.
      expect(await until(() => sweepsOf(app).stats().running === 0 && sweepsOf(app).stats().waiting === 0, 1500)).toBe(true);
      const next = await api(app.baseUrl, "/api/sweep", { cookie, body: small() });
      expect(next.status).toBe(200);
    });
  });

  it("answers 429 busy with Retry-After when the queue is full, and when one user has too many sweeps", async () => {
    await withApp({ STILLSPAN_SWEEP_WORKERS: "1", STILLSPAN_SWEEP_QUEUE: "1", STILLSPAN_SWEEP_QUEUE_PER_USER: "2" }, async (app, cookie) => {
      expect((await api(app.baseUrl, "/api/sweep", { cookie, body: small() })).status).toBe(200);
      const admin = await signIn(app.baseUrl, "admin@stillspan.test");
      const first = api(app.baseUrl, "/api/sweep", { cookie, body: long() });
      expect(await until(() => sweepsOf(app).stats().running === 1, 5000)).toBe(true);
      const second = api(app.baseUrl, "/api/sweep", { cookie, body: small() });
      expect(await until(() => sweepsOf(app).stats().waiting === 1, 5000)).toBe(true);

      const mine = await api(app.baseUrl, "/api/sweep", { cookie, body: small() });
      expect(mine.status).toBe(429);
      expect(mine.body.error.code).toBe("busy");
      expect(mine.body.error.message).toContain("you already have 2 sweeps waiting or running");
      expect(Number(mine.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);

      const full = await api(app.baseUrl, "/api/sweep", { cookie: admin, body: small() });
      expect(full.status).toBe(429);
      expect(full.body.error.message).toContain("1 sweep is already waiting");
      expect(Number(full.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);

      expect((await first).status).toBe(200);
      expect((await second).status).toBe(200);
    });
  });

  it("cuts off a request whose body arrives too slowly (STILLSPAN_REQUEST_TIMEOUT_MS), but lets a long sweep answer", async () => {
    await withApp({ STILLSPAN_REQUEST_TIMEOUT_MS: "1000" }, async (app, cookie) => {
      const { port } = new URL(app.baseUrl);
      const socket = net.connect(Number(port), "127.0.0.1");
      await new Promise((resolve) => socket.once("connect", resolve));
      let answer = "";
      socket.on("data", (d: Buffer) => (answer += d.toString()));
      const closed = new Promise<number>((resolve) => socket.once("close", () => resolve(Date.now())));
      const started = Date.now();
      socket.write(`POST /api/sweep HTTP/1.1\r\nHost: 127.0.0.1\r\nCookie: ${cookie}\r\nContent-Type: application/json\r\nContent-Length: 1000\r\n\r\n{`);
      // One byte every 200 ms: 1,000 bytes would take over three minutes.
      const drip = setInterval(() => socket.writable && socket.write(" "), 200);
      const within = await Promise.race([closed, new Promise<null>((resolve) => setTimeout(() => resolve(null), 10_000))]);
      clearInterval(drip);
      socket.destroy();
      expect(within, "the connection must be closed by the server").not.toBeNull();
      expect(within! - started).toBeLessThan(5000);
      expect(answer).toMatch(/^HTTP\/1\.1 408/);
      // The limit covers receiving the request only: a sweep computing longer than it still answers.
      const res = await api(app.baseUrl, "/api/sweep", { cookie, body: long() });
      expect(res.status).toBe(200);
    });
  });

  it("closes the app's sweep pool with the app: a running sweep ends with 503 and its worker stops", async () => {
    const app = await startTestApp({ env: { STILLSPAN_SWEEP_WORKERS: "1" } });
    const cookie = await signIn(app.baseUrl, "analyst@stillspan.test");
    expect((await api(app.baseUrl, "/api/sweep", { cookie, body: small() })).status).toBe(200);
    const pool = sweepsOf(app);
    expect(pool.settings.workers).toBe(1);
    const running = api(app.baseUrl, "/api/sweep", { cookie, body: long() }).catch(() => null);
    expect(await until(() => pool.stats().running === 1, 5000)).toBe(true);
    await app.close();
    await running;
    expect(pool.stats()).toEqual({ workers: 0, running: 0, waiting: 0 });
  });
});
