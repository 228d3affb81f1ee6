/**
 * Password-reset requests must not tell which accounts exist by their timing. Requests for existing accounts (a
 * fresh account each, so the per-account throttle never shortens the work) and for unknown addresses alternate,
 * and their median answer times are compared.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { insertUser } from "../../server/db/queries/users.js";
import { openTestDb } from "../support/db.js";
import { testEnv } from "../support/env.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
const suffix = Date.now().toString(36);
const PAIRS = 30;
const known: string[] = [];

beforeAll(async () => {
  for (let i = 0; i < PAIRS; i++) {
    const email = `timing-${suffix}-${i}@stillspan.test`;
    // Never signed in: the hash only has to be a string.
    await insertUser(db, { email, name: `Timing ${i}`, passwordHash: "$2b$12$unused" });
    known.push(email);
  }
});
afterAll(() => db.$client.end());

async function timed(email: string): Promise<number> {
  const started = performance.now();
  const res = await fetch(`${base()}/api/auth/password-reset`, {
    method: "POST",
    headers: { "Content-Type": "application/json" },
    body: JSON.stringify({ email }),
  });
  await res.text();
  const ms = performance.now() - started;
  expect(res.status).toBe(202);
  return ms;
}

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  return (sorted[(sorted.length - 1) >> 1] + sorted[sorted.length >> 1]) / 2;
};
const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe("POST /api/auth/password-reset timing", () => {
  it("takes the same time for an existing account and an unknown address (medians within 2.5 ms or 30 %)", async () => {
    await timed(`warm-up-${suffix}@nowhere.test`);
    const existing: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < PAIRS; i++) {
      // Each pair in turn order, with a pause for the background work of the one before, so load hits both alike.
      const pair = [() => timed(known[i]).then((ms) => existing.push(ms)), () => timed(`nobody-${suffix}-${i}@stillspan.test`).then((ms) => unknown.push(ms))];
      for (const request of i % 2 === 0 ? pair : pair.reverse()) {
        await request();
        await pause(100);
      }
    }
    const [a, b] = [median(existing), median(unknown)];
    const tolerance = Math.max(2.5, 0.3 * Math.min(a, b));
    expect(
      Math.abs(a - b),
      `median answer ${a.toFixed(1)} ms for existing accounts, ${b.toFixed(1)} ms for unknown addresses (tolerance ${tolerance.toFixed(1)} ms)`,
    ).toBeLessThanOrEqual(tolerance);
  });
});
