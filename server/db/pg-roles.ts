/**
 * The two database roles. Migrations run as the **owner** role, which owns the database, its schemas and
 * tables; the app connects as the **app** role, which may read and write rows and nothing else — no DDL, no
 * TRUNCATE, no trigger changes (only a table's owner or a superuser may disable its triggers), so the
 * append-only guards on revisions and the review history hold against the app itself.
 *
 * On the project's own cluster both roles are created here with generated passwords, kept beside the cluster's
 * superuser password (mode 0600). With an external server the operator creates them and gives their URLs
 * (DATABASE_URL for the app role, DATABASE_OWNER_URL for the owner; see DEVELOPERS.md).
 */
import { randomBytes } from "node:crypto";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import pg from "pg";
import type { Db } from "./client.js";

export const OWNER_ROLE = "stillspan_owner";
export const APP_ROLE = "stillspan_app";

/**
 * Schemas whose tables the app role may read and write. A feature whose migration creates a schema of its own
 * (e.g. a job queue created by the owner during migration) adds it here; grants then cover its present and
 * future tables and sequences.
 */
export const APP_SCHEMAS: readonly string[] = ["public"];

const ident = (name: string) => pg.escapeIdentifier(name);

/** The password of a role on the local cluster: read from `<baseDir>/<role>-password`, generated (0600) when missing. */
export function rolePassword(baseDir: string, role: string): string {
  const file = path.join(baseDir, `${role}-password`);
  if (!existsSync(file)) writeFileSync(file, randomBytes(24).toString("base64url") + "\n", { mode: 0o600, flag: "wx" });
  return readFileSync(file, "utf8").trim();
}

async function withClient<T>(url: string, fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/**
 * Creates (or updates) the owner and app roles on the local cluster, as its superuser. The owner may create
 * databases (the test runner makes one per run) but is no superuser; the app role may only log in.
 */
export async function ensureLocalRoles(superuserUrl: string, baseDir: string): Promise<void> {
  const roles = [
    { name: OWNER_ROLE, options: "LOGIN CREATEDB NOSUPERUSER NOCREATEROLE NOREPLICATION NOBYPASSRLS" },
    { name: APP_ROLE, options: "LOGIN NOCREATEDB NOSUPERUSER NOCREATEROLE NOREPLICATION NOBYPASSRLS" },
  ];
  await withClient(superuserUrl, async (c) => {
    for (const role of roles) {
      const password = c.escapeLiteral(rolePassword(baseDir, role.name));
      const { rowCount } = await c.query("SELECT 1 FROM pg_roles WHERE rolname = $1", [role.name]);
      // A concurrent start may create the role between the check and the CREATE: the ALTER then sets it alike.
      const verb = rowCount ? "ALTER" : "CREATE";
      await c.query(`${verb} ROLE ${ident(role.name)} WITH ${role.options} PASSWORD ${password}`).catch(async (err: unknown) => {
        if ((err as { code?: string }).code !== "42710") throw err; // duplicate_object
        await c.query(`ALTER ROLE ${ident(role.name)} WITH ${role.options} PASSWORD ${password}`);
      });
    }
  });
}

/**
 * Gives a database made by an earlier version (everything owned by the cluster's superuser) to the owner role:
 * the database, its schemas other than the system ones, and their tables, views, sequences, types and functions.
 * Runs as the superuser, connected to that database; a no-op when the owner already owns it all.
 */
export async function handOverDatabase(superuserDbUrl: string, owner: string): Promise<void> {
  await withClient(superuserDbUrl, async (c) => {
    await c.query(`ALTER DATABASE ${ident(new URL(superuserDbUrl).pathname.slice(1))} OWNER TO ${ident(owner)}`);
    await c.query(
      `DO $$
       DECLARE r record; target text := ${c.escapeLiteral(owner)};
       BEGIN
         FOR r IN SELECT n.nspname FROM pg_namespace n
                  WHERE n.nspname NOT IN ('public', 'information_schema') AND n.nspname NOT LIKE 'pg\\_%'
                    AND pg_get_userbyid(n.nspowner) <> target LOOP
           EXECUTE format('ALTER SCHEMA %I OWNER TO %I', r.nspname, target);
         END LOOP;
         FOR r IN SELECT n.nspname, c.relname, c.relkind FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
                  WHERE n.nspname NOT IN ('information_schema') AND n.nspname NOT LIKE 'pg\\_%'
                    AND c.relkind IN ('r', 'p', 'v', 'm', 'S', 'f') AND pg_get_userbyid(c.relowner) <> target
                    -- a sequence owned by a column follows its table
                    AND NOT (c.relkind = 'S' AND EXISTS (SELECT 1 FROM pg_depend d WHERE d.objid = c.oid AND d.deptype IN ('a', 'i'))) LOOP
           EXECUTE format('ALTER %s %I.%I OWNER TO %I',
             CASE r.relkind WHEN 'v' THEN 'VIEW' WHEN 'm' THEN 'MATERIALIZED VIEW' WHEN 'S' THEN 'SEQUENCE'
                            WHEN 'f' THEN 'FOREIGN TABLE' ELSE 'TABLE' END, r.nspname, r.relname, target);
         END LOOP;
         FOR r IN SELECT t.oid::regtype::text AS name FROM pg_type t JOIN pg_namespace n ON n.oid = t.typnamespace
                  WHERE n.nspname NOT IN ('information_schema') AND n.nspname NOT LIKE 'pg\\_%'
                    AND t.typtype IN ('e', 'd') AND pg_get_userbyid(t.typowner) <> target LOOP
           EXECUTE format('ALTER TYPE %s OWNER TO %I', r.name, target);
         END LOOP;
         FOR r IN SELECT p.oid::regprocedure::text AS name FROM pg_proc p JOIN pg_namespace n ON n.oid = p.pronamespace
                  WHERE n.nspname NOT IN ('information_schema') AND n.nspname NOT LIKE 'pg\\_%'
                    AND pg_get_userbyid(p.proowner) <> target LOOP
           EXECUTE format('ALTER ROUTINE %s OWNER TO %I', r.name, target);
         END LOOP;
       END $$`,
    );
  });
}

/** The role a connection logs in as. */
export async function currentRole(db: Db): Promise<string> {
  const { rows } = await db.$client.query<{ role: string }>("SELECT current_user AS role");
  return rows[0].role;
}

/**
 * Run by the owner after the migrations: the app role may use the app's schemas and read and write the rows of
 * every table in them — present ones, and (default privileges) those later migrations create. Nobody but the
 * owner may create objects in `public` or temporary tables in the database. Idempotent; cheap enough for every start.
 */
export async function grantAppRole(ownerDb: Db, appRole: string): Promise<void> {
  const app = ident(appRole);
  const statements = [
    "REVOKE CREATE ON SCHEMA public FROM PUBLIC",
    `DO $$ BEGIN EXECUTE format('REVOKE TEMPORARY ON DATABASE %I FROM PUBLIC', current_database()); END $$`,
    ...APP_SCHEMAS.flatMap((name) => {
      const schema = ident(name);
      return [
        `GRANT USAGE ON SCHEMA ${schema} TO ${app}`,
        `GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA ${schema} TO ${app}`,
        `GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA ${schema} TO ${app}`,
        `ALTER DEFAULT PRIVILEGES IN SCHEMA ${schema} GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO ${app}`,
        `ALTER DEFAULT PRIVILEGES IN SCHEMA ${schema} GRANT USAGE, SELECT ON SEQUENCES TO ${app}`,
      ];
    }),
  ];
  const client = await ownerDb.$client.connect();
  try {
    await client.query("BEGIN");
    for (const statement of statements) await client.query(statement);
    await client.query("COMMIT");
  } catch (err) {
    await client.query("ROLLBACK").catch(() => undefined);
    throw err;
  } finally {
    client.release();
  }
}
