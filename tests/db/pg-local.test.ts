import { createHash } from "node:crypto";
import { chmodSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { projectRoot } from "../../server/config.js";
import { createDb } from "../../server/db/client.js";
import { runMigrations } from "../../server/db/migrate.js";
import {
  createDatabase,
  dropDatabase,
  ensureLocalPostgres,
  resolveBaseDir,
  stopLocalPostgres,
  type LocalPostgres,
} from "../../server/db/pg-local.js";
import { APP_ROLE, OWNER_ROLE } from "../../server/db/pg-roles.js";
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

describe("the project's own cluster: roles and an earlier version's database", () => {
  const dataDir = mkdtempSync(path.join(os.tmpdir(), "stillspan-roles-"));
  chmodSync(dataDir, 0o755);
  const quiet = logger.child({}, { level: "silent" });
  let cluster: LocalPostgres;
  beforeAll(async () => {
    const port = await new Promise<number>((resolve) => {
      const probe = net.createServer().listen(0, "127.0.0.1", () => {
        const { port: free } = probe.address() as net.AddressInfo;
        probe.close(() => resolve(free));
      });
    });
    cluster = await ensureLocalPostgres({ projectRoot, port, dataDir, logger: quiet });
  }, 120_000);
  afterAll(async () => {
    await stopLocalPostgres({ projectRoot, port: 0, dataDir, logger: quiet }).catch(() => undefined);
    rmSync(dataDir, { recursive: true, force: true });
  });

  it("creates the owner and the app role with generated passwords kept beside the cluster (mode 0600)", async () => {
    for (const role of [OWNER_ROLE, APP_ROLE]) {
      const file = path.join(cluster.baseDir, `${role}-password`);
      expect(statSync(file).mode & 0o777, file).toBe(0o600);
      expect(readFileSync(file, "utf8").trim()).toMatch(/^[A-Za-z0-9_-]{32}$/);
    }
    const client = new pg.Client({ connectionString: cluster.url });
    await client.connect();
    try {
      const { rows } = await client.query<{ rolname: string; rolsuper: boolean; rolcreatedb: boolean; rolcreaterole: boolean }>(
        "SELECT rolname, rolsuper, rolcreatedb, rolcreaterole FROM pg_roles WHERE rolname = ANY($1) ORDER BY rolname",
        [[OWNER_ROLE, APP_ROLE]],
      );
      expect(rows).toEqual([
        { rolname: APP_ROLE, rolsuper: false, rolcreatedb: false, rolcreaterole: false },
        { rolname: OWNER_ROLE, rolsuper: false, rolcreatedb: true, rolcreaterole: false },
      ]);
    } finally {
      await client.end();
    }
  });

  it("hands a database made by an earlier version (owned by the superuser) to the owner role, so its migrations run as the owner", async () => {
    const name = "earlier_version";
    // As before: the database, its tables and the append-only trigger, all made by the superuser.
    await createDatabase(cluster.url, name);
    const old = createDb(cluster.urlFor(name), { max: 1 });
    await runMigrations(old);
    await old.$client.end();

    await createDatabase(cluster.url, name, OWNER_ROLE);
    const owner = createDb(cluster.ownerUrlFor(name), { max: 1 });
    const app = createDb(cluster.appUrlFor(name), { max: 1 });
    try {
      await runMigrations(owner, { appRole: APP_ROLE });
      const { rows } = await owner.$client.query<{ n: number }>(
        `SELECT count(*)::int AS n FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
         WHERE n.nspname IN ('public', 'drizzle') AND c.relkind IN ('r', 'S') AND pg_get_userbyid(c.relowner) <> $1`,
        [OWNER_ROLE],
      );
      expect(rows[0].n, "tables and sequences not owned by the owner role").toBe(0);
      // The owner can now change what the superuser made; the app role reads and writes rows only.
      await owner.$client.query("ALTER TABLE review_comments ADD COLUMN probe int");
      await owner.$client.query("ALTER TABLE review_comments DROP COLUMN probe");
      expect((await app.$client.query("SELECT count(*) FROM users")).rowCount).toBe(1);
      await expect(app.$client.query("DROP TABLE review_comments")).rejects.toMatchObject({ code: "42501" });
    } finally {
      await owner.$client.end();
      await app.$client.end();
      await dropDatabase(cluster.url, name);
    }
  });
});
