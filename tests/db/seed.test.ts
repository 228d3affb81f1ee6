import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { loadConfig } from "../../server/config.js";
import { createDb, type Db } from "../../server/db/client.js";
import { runMigrations } from "../../server/db/migrate.js";
import { createDatabase, dropDatabase } from "../../server/db/pg-local.js";
import { prepareDatabaseContent, seedDemo } from "../../server/db/seed.js";
import { memberships, projects, users } from "../../server/db/schema/index.js";
import { logger } from "../../server/logger.js";
import { verifyPassword } from "../../server/services/passwords.js";
import { testEnv } from "../support/env.js";

const quiet = logger.child({}, { level: "silent" });
/** URL of another database on the test server. */
function databaseUrl(name: string): string {
  const url = new URL(testEnv.databaseUrl);
  url.pathname = `/${name}`;
  return url.toString();
}

// Named after this run's test database, so concurrent runs each have their own scratch database.
const SCRATCH = `${new URL(testEnv.databaseUrl).pathname.slice(1)}_seed`;

describe("seed on a fresh database", () => {
  let db: Db;
  beforeAll(async () => {
    await dropDatabase(databaseUrl("postgres"), SCRATCH);
    await createDatabase(databaseUrl("postgres"), SCRATCH);
    db = createDb(databaseUrl(SCRATCH), { max: 2 });
    await runMigrations(db); // every migration in drizzle/ applies from scratch
  });
  afterAll(async () => {
    await db.$client.end();
    await dropDatabase(databaseUrl("postgres"), SCRATCH);
  });

  it("with STILLSPAN_SEED=none creates only the first administrator from the environment", async () => {
    const config = loadConfig({
      STILLSPAN_SEED: "none",
      STILLSPAN_ADMIN_EMAIL: "Ops@Example.org",
      STILLSPAN_ADMIN_PASSWORD: "a-long-enough-password",
      STILLSPAN_SESSION_SECRET: "s".repeat(32),
    });

    expect(await prepareDatabaseContent(db, config, quiet)).toBe("admin");
    const all = await db.select().from(users);
    expect(all.map((u) => [u.email, u.isAdmin])).toEqual([["ops@example.org", true]]);
    expect(await verifyPassword("a-long-enough-password", all[0].passwordHash)).toBe(true);
    expect(all[0].passwordHash).toMatch(/^\$2[aby]\$1[0-9]\$/); // bcrypt, cost ≥ 10
    // A second start changes nothing, and the demo seed stays away from a database that has users.
    expect(await prepareDatabaseContent(db, config, quiet)).toBe("none");
    expect(await seedDemo(db, { ...config, seed: "demo" }, quiet)).toBe(false);
    expect((await db.select({ n: count() }).from(users))[0].n).toBe(1);
  });
});

describe("demo seed in the test database", () => {
  const db = createDb(testEnv.databaseUrl, { max: 2 });
  afterAll(() => db.$client.end());

  it("holds the invented crossing with analyst, reviewer and viewer memberships, and does not run twice", async () => {
    const [project] = await db.select().from(projects).where(eq(projects.name, "Harrowmere Estuary Crossing (invented demo)"));
    expect(project.description).toMatch(/INVENTED/);
    const roles = await db
      .select({ email: users.email, role: memberships.role })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.projectId, project.id));
    expect(roles.map((r) => `${r.email}:${r.role}`).sort()).toEqual([
      "analyst@stillspan.test:analyst",
      "reviewer@stillspan.test:reviewer",
      "viewer@stillspan.test:viewer",
    ]);
    expect(await seedDemo(db, loadConfig({ STILLSPAN_SESSION_SECRET: "s".repeat(32) }), quiet)).toBe(false);
  });
});
