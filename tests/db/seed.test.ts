import { count, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { loadConfig } from "../../server/config.js";
import { createDb, type Db } from "../../server/db/client.js";
import { runMigrations } from "../../server/db/migrate.js";
import { createDatabase, dropDatabase } from "../../server/db/pg-local.js";
import { prepareDatabaseContent, seedDemo } from "../../server/db/seed.js";
import { memberships, projects, users } from "../../server/db/schema/index.js";
import { demoAccounts } from "../../server/db/seed/accounts.js";
import { demoAlternatives } from "../../server/db/seed/alternatives.js";
import { demoCriteria } from "../../server/db/seed/criteria.js";
import { demoProject } from "../../server/db/seed/projects.js";
import { demoReview } from "../../server/db/seed/review.js";
import { ref, type SeedContext } from "../../server/db/seed/types.js";
import { createStudy } from "../../server/services/studies.js";
import { runSweepInProcess } from "../../server/services/sweep-compute.js";
import { seedUser } from "../../server/db/seed/alternatives.js";
import { logger } from "../../server/logger.js";
import { verifyPassword } from "../../server/services/passwords.js";
import { testEnv } from "../support/env.js";
import { inventedStudy } from "../support/review.js";

const quiet = logger.child({}, { level: "silent" });
const testConfig = () => loadConfig({ STILLSPAN_SESSION_SECRET: "s".repeat(32) });

/** Revisions (of one project, or all) whose number of creation audit events is not exactly one. */
async function revisionsWithoutOneAuditEvent(db: Db, projectId?: number) {
  const { rows } = await db.execute<{ id: number; n: number }>(sql`
    select r.id, (
      select count(*)::int from audit_events a
      where (a.action = 'revision.create' and a.object_type = 'revision' and a.object_id = r.id::text)
         or (a.action = 'study.create' and a.object_type = 'study' and a.details->'firstRevision'->>'id' = r.id::text)
    ) as n
    from study_revisions r
    join studies s on s.id = r.study_id
    join alternatives alt on alt.id = s.alternative_id
    where ${projectId === undefined ? sql`true` : sql`alt.project_id = ${projectId}`}`);
  return { total: rows.length, wrong: rows.filter((r) => r.n !== 1) };
}

/** Review history entries (submitted, commented, returned, signed, reassigned) without their audit event, per revision and kind. */
async function reviewEventsWithoutAudit(db: Db) {
  const { rows } = await db.execute<{ revision_id: number; kind: string; events: number; audits: number }>(sql`
    select e.revision_id, e.kind, count(*)::int as events, (
      select count(*)::int from audit_events a
      where a.object_type = 'revision' and a.object_id = e.revision_id::text
        and a.action = 'review.' || case e.kind when 'submitted' then 'submit' when 'commented' then 'comment'
                                                when 'returned' then 'return' when 'reassigned' then 'reassign' else 'sign' end
    ) as audits
    from review_events e group by e.revision_id, e.kind`);
  return { total: rows.length, wrong: rows.filter((r) => r.events !== r.audits) };
}
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

  it("the review step, given a study with one revision, stores the next revision and the review with their audit events", async () => {
    const oneRevisionStudy = {
      name: "one-revision study",
      async run(ctx: SeedContext) {
        const study = await createStudy(ctx.tx, runSweepInProcess, await seedUser(ctx, "user:analyst"), ref(ctx, "alternative:single"), {
          name: "Flutter — one revision",
          purpose: "Seed test",
          study: inventedStudy(),
        });
        ctx.refs.set("study:single", Number(study.id));
      },
    };
    await db.transaction(async (tx) => {
      const ctx: SeedContext = { tx, config: testConfig(), log: quiet, refs: new Map() };
      for (const step of [demoAccounts, demoProject, demoCriteria, demoAlternatives, oneRevisionStudy, demoReview]) await step.run(ctx);
    });

    const revisions = await revisionsWithoutOneAuditEvent(db);
    expect(revisions.total).toBe(2);
    expect(revisions.wrong, "revisions whose creation audit events are not exactly one").toEqual([]);
    const review = await reviewEventsWithoutAudit(db);
    expect(review.total).toBeGreaterThanOrEqual(3); // submitted and signed on revision 1, submitted on revision 2
    expect(review.wrong, "review history entries without their audit event").toEqual([]);
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
    expect(await seedDemo(db, testConfig(), quiet)).toBe(false);
  });

  it("stores every revision of the demo crossing with exactly one audit event, and every review step with its own", async () => {
    const [project] = await db.select().from(projects).where(eq(projects.name, "Harrowmere Estuary Crossing (invented demo)"));
    const revisions = await revisionsWithoutOneAuditEvent(db, project.id);
    expect(revisions.total).toBeGreaterThanOrEqual(4);
    expect(revisions.wrong, "revisions whose creation audit events are not exactly one").toEqual([]);
    expect((await reviewEventsWithoutAudit(db)).wrong, "review history entries without their audit event").toEqual([]);
  });
});
