import { createHash } from "node:crypto";
import { chmodSync, mkdirSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { resolveBaseDir } from "../../server/db/pg-local.js";
import { logger } from "../../server/logger.js";

const isRoot = process.getuid?.() === 0;

describe("resolveBaseDir", () => {
  const outer = mkdtempSync(path.join(os.tmpdir(), "stillspan-private-"));
  const project = path.join(outer, "checkout");
  const fallback = path.join(os.tmpdir(), `stillspan-pg-${createHash("sha256").update(project).digest("hex").slice(0, 12)}`);
  afterAll(() => {
    rmSync(outer, { recursive: true, force: true });
    rmSync(fallback, { recursive: true, force: true });
  });

  it("keeps the data inside a project the postgres user can reach", async () => {
    const open = mkdtempSync(path.join(os.tmpdir(), "stillspan-open-"));
    chmodSync(open, 0o755);
    try {
      expect(await resolveBaseDir(open, logger)).toBe(path.join(open, ".data", "postgres"));
    } finally {
      rmSync(open, { recursive: true, force: true });
    }
  });

  it("falls back to the temp folder, keyed by the project path, under a parent with mode 700", async () => {
    mkdirSync(project, { recursive: true });
    chmodSync(outer, 0o700);
    // As root the cluster runs as `postgres`, which cannot pass the 700 folder; as a normal user the server runs
    // as that user, who can, so the data stays in the project.
    const expected = isRoot ? fallback : path.join(project, ".data", "postgres");
    expect(await resolveBaseDir(project, logger)).toBe(expected);
  });
});
