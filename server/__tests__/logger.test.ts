import { Writable } from "node:stream";
import { describe, expect, it } from "vitest";
import { createLogger, serializeError } from "../logger.js";

/** A Drizzle-like query error: the message, a `params` list and a cause, each holding user data. */
function failedInsert(bytes: number): Error {
  const document = JSON.stringify({ name: "x\u0000", result: "r".repeat(bytes) });
  const cause = Object.assign(new Error("invalid byte sequence for encoding \"UTF8\": 0x00"), { code: "22021", severity: "ERROR" });
  return Object.assign(new Error(`Failed query: insert into "study_revisions" values ($1, $2)\nparams: 1,${document}`, { cause }), {
    name: "DrizzleQueryError",
    query: 'insert into "study_revisions" values ($1, $2)',
    params: [1, document],
    body: document,
  });
}

describe("bounded error logging", () => {
  it("keeps the type, code, SQL and cause of a failed query, clipped, and never its parameters or the body", () => {
    const out = serializeError(failedInsert(5_000_000));
    const text = JSON.stringify(out);
    expect(text.length).toBeLessThan(10_000);
    expect(out).toMatchObject({
      type: "DrizzleQueryError",
      query: 'insert into "study_revisions" values ($1, $2)',
      cause: { code: "22021", severity: "ERROR", message: expect.stringContaining("0x00") },
    });
    expect(out).not.toHaveProperty("params");
    expect(out).not.toHaveProperty("body");
    expect(out.message).toMatch(/… \(\d+ characters\)$/);
    expect(String(out.stack)).not.toContain("rrrr");
  });

  it("one logged 5 MB failure writes a line of a few kB", () => {
    let written = 0;
    const sink = new Writable({
      write(chunk, _encoding, done) {
        written += chunk.length;
        done();
      },
    });
    const log = createLogger({ level: "info", destination: sink });
    log.error({ err: failedInsert(5_000_000), path: "/api/studies/1/revisions" }, "unhandled error");
    expect(written).toBeGreaterThan(100);
    expect(written).toBeLessThan(10_000);
  });
});
