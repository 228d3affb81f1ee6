/**
 * The app's database role can do what the app does and nothing more: no DDL, no TRUNCATE, no trigger changes, no
 * superuser powers, owner of nothing — so the append-only guards on revisions, review history, comments and
 * signatures hold against the app itself. Each attempt runs in a transaction that is rolled back.
 */
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { APP_SCHEMAS } from "../../server/db/pg-roles.js";
import { testEnv } from "../support/env.js";

let app: pg.Client;
let owner: pg.Client;
let ids: { revisionId: number; userId: number };

beforeAll(async () => {
  app = new pg.Client({ connectionString: testEnv.appDatabaseUrl });
  owner = new pg.Client({ connectionString: testEnv.databaseUrl });
  await Promise.all([app.connect(), owner.connect()]);
  const { rows } = await owner.query<{ revision_id: number; user_id: number }>(
    "SELECT (SELECT min(id) FROM study_revisions) AS revision_id, (SELECT min(id) FROM users) AS user_id",
  );
  ids = { revisionId: rows[0].revision_id, userId: rows[0].user_id };
});
afterAll(async () => {
  await Promise.all([app?.end(), owner?.end()]);
});

/**
 * Runs `sql` as the app role inside a transaction that is always rolled back (after `setup`, in the same
 * transaction); the SQLSTATE it failed with, or "ok (n rows)".
 */
async function attempt(sql: string, params: unknown[] = [], setup?: { sql: string; params: unknown[] }): Promise<string> {
  await app.query("BEGIN");
  try {
    if (setup) await app.query(setup.sql, setup.params);
    const result = await app.query(sql, params);
    return `ok (${result.rowCount ?? 0} rows)`;
  } catch (err) {
    return (err as { code?: string }).code ?? String(err);
  } finally {
    await app.query("ROLLBACK");
  }
}

const INSUFFICIENT_PRIVILEGE = "42501";
const APPEND_ONLY = "23000"; // integrity_constraint_violation, raised by the append-only triggers

describe("the app's database role", () => {
  it("is neither a superuser nor the owner of the database or of any table", async () => {
    const { rows } = await app.query<{ role: string; superuser: boolean; owns_db: boolean; owned_tables: number }>(`
      SELECT current_user AS role,
             (SELECT rolsuper FROM pg_roles WHERE rolname = current_user) AS superuser,
             (SELECT pg_get_userbyid(datdba) = current_user FROM pg_database WHERE datname = current_database()) AS owns_db,
             (SELECT count(*)::int FROM pg_tables WHERE tableowner = current_user) AS owned_tables`);
    expect(rows[0]).toMatchObject({ superuser: false, owns_db: false, owned_tables: 0 });
    const { rows: ownerRows } = await owner.query<{ role: string }>("SELECT current_user AS role");
    expect(rows[0].role).not.toBe(ownerRows[0].role);
  });

  it("cannot drop, alter or truncate a table, create one, or switch triggers off", async () => {
    const refused = {
      "DROP TABLE study_revisions": await attempt("DROP TABLE study_revisions"),
      "ALTER TABLE … ADD COLUMN": await attempt("ALTER TABLE review_comments ADD COLUMN edited boolean"),
      "ALTER TABLE … DISABLE TRIGGER": await attempt("ALTER TABLE study_revisions DISABLE TRIGGER ALL"),
      "DROP TRIGGER": await attempt('DROP TRIGGER "review_events_no_update_or_delete" ON review_events'),
      "session_replication_role = replica": await attempt("SET LOCAL session_replication_role = replica"),
      "TRUNCATE": await attempt("TRUNCATE review_events"),
      "CREATE TABLE": await attempt("CREATE TABLE roles_probe (x int)"),
      "CREATE TEMP TABLE": await attempt("CREATE TEMP TABLE roles_probe (x int)"),
      "CREATE FUNCTION": await attempt("CREATE FUNCTION roles_probe() RETURNS int LANGUAGE sql AS 'SELECT 1'"),
    };
    expect(refused).toEqual(Object.fromEntries(Object.keys(refused).map((k) => [k, INSUFFICIENT_PRIVILEGE])));
  });

  it("cannot update or delete revisions, review history, comments, signatures or assessments (the triggers refuse)", async () => {
    const { rows } = await app.query<{ n: number }>("SELECT count(*)::int AS n FROM signatures");
    expect(rows[0].n, "the demo seed stores a signed summary").toBeGreaterThan(0);
    const assessed = await app.query<{ n: number }>("SELECT count(*)::int AS n FROM revision_assessments");
    expect(assessed.rows[0].n, "every seeded revision is assessed when it is saved").toBeGreaterThan(0);
    // Rows of the app's own making in the same rolled-back transaction, so every table has one to aim at.
    const withRows = (statement: string) =>
      attempt(statement, [], {
        sql: `WITH e AS (INSERT INTO review_events (revision_id, kind, actor_id) VALUES ($1, 'commented', $2)),
                   c AS (INSERT INTO review_comments (revision_id, author_id, body) VALUES ($1, $2, 'probe'))
              SELECT 1`,
        params: [ids.revisionId, ids.userId],
      });
    const refused = {
      "UPDATE study_revisions": await attempt("UPDATE study_revisions SET change_note = 'changed'"),
      "DELETE study_revisions": await attempt("DELETE FROM study_revisions"),
      "UPDATE review_events": await withRows("UPDATE review_events SET note = 'changed'"),
      "DELETE review_events": await withRows("DELETE FROM review_events"),
      "UPDATE review_comments": await withRows("UPDATE review_comments SET body = 'changed'"),
      "DELETE review_comments": await withRows("DELETE FROM review_comments"),
      "UPDATE signatures": await attempt("UPDATE signatures SET kid = 'changed'"),
      "DELETE signatures": await attempt("DELETE FROM signatures"),
      "UPDATE revision_assessments": await attempt("UPDATE revision_assessments SET assessor = 'changed'"),
      "DELETE revision_assessments": await attempt("DELETE FROM revision_assessments"),
    };
    expect(refused).toEqual(Object.fromEntries(Object.keys(refused).map((k) => [k, APPEND_ONLY])));
  });

  it("may use every schema of the app's tables", async () => {
    const { rows } = await app.query<{ schema: string; usage: boolean; create: boolean }>(
      "SELECT s AS schema, has_schema_privilege(s, 'USAGE') AS usage, has_schema_privilege(s, 'CREATE') AS create FROM unnest($1::text[]) AS s",
      [APP_SCHEMAS],
    );
    expect(rows).toEqual(APP_SCHEMAS.map((schema) => ({ schema, usage: true, create: false })));
  });

  it("may read and write the rows of the app's tables, including tables a later migration creates", async () => {
    expect(await attempt("INSERT INTO review_comments (revision_id, author_id, body) VALUES ($1, $2, 'allowed')", [ids.revisionId, ids.userId])).toBe(
      "ok (1 rows)",
    );
    expect(await attempt("UPDATE projects SET updated_at = updated_at")).toMatch(/^ok/);
    // A table the owner creates after the grants (as a migration would) is the app's to use too.
    const table = `roles_probe_${process.pid}`;
    await owner.query(`CREATE TABLE ${table} (id serial PRIMARY KEY, x int)`);
    try {
      expect(await attempt(`INSERT INTO ${table} (x) VALUES (1)`)).toBe("ok (1 rows)");
      expect(await attempt(`DROP TABLE ${table}`)).toBe(INSUFFICIENT_PRIVILEGE);
    } finally {
      await owner.query(`DROP TABLE ${table}`);
    }
  });
});
