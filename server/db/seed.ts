import { count } from "drizzle-orm";
import type { Config } from "../config.js";
import type { Logger } from "../logger.js";
import { hashPassword } from "../services/passwords.js";
import type { Db } from "./client.js";
import { writeAudit } from "./queries/audit.js";
import { users } from "./schema/index.js";
import { DEMO_SEED_STEPS } from "./seed/steps.js";
import type { SeedContext } from "./seed/types.js";

async function isEmpty(db: Db): Promise<boolean> {
  const [{ n }] = await db.select({ n: count() }).from(users);
  return n === 0;
}

/** Runs the demo seed steps in one transaction, only on an empty database. Returns whether it seeded. */
export async function seedDemo(db: Db, config: Config, log: Logger): Promise<boolean> {
  if (!(await isEmpty(db))) return false;
  await db.transaction(async (tx) => {
    // Serialise concurrent starts: the second waits, then sees users and stops.
    await tx.execute("LOCK TABLE users IN EXCLUSIVE MODE");
    const [{ n }] = await tx.select({ n: count() }).from(users);
    if (n > 0) return;
    const ctx: SeedContext = { tx, config, log, refs: new Map() };
    for (const step of DEMO_SEED_STEPS) {
      log.info({ step: step.name }, "seeding");
      await step.run(ctx);
    }
    await writeAudit(tx, { actorId: null, action: "seed.demo", objectType: "database", details: { steps: DEMO_SEED_STEPS.map((s) => s.name) } });
  });
  return true;
}

/** Production: the first admin from STILLSPAN_ADMIN_EMAIL / STILLSPAN_ADMIN_PASSWORD when nobody exists yet. */
export async function createFirstAdmin(db: Db, config: Config, log: Logger): Promise<boolean> {
  if (!config.admin || !(await isEmpty(db))) return false;
  const { email, password } = config.admin;
  await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(users)
      .values({ email, name: "Administrator", isAdmin: true, passwordHash: await hashPassword(password) })
      .returning({ id: users.id });
    await writeAudit(tx, { actorId: null, action: "user.create-first-admin", objectType: "user", objectId: row.id });
  });
  log.info({ email }, "first administrator created from the environment");
  return true;
}

/** At start: the demo seed (STILLSPAN_SEED=demo) or the first admin (STILLSPAN_SEED=none). */
export async function prepareDatabaseContent(db: Db, config: Config, log: Logger): Promise<"demo" | "admin" | "none"> {
  if (config.seed === "demo") return (await seedDemo(db, config, log)) ? "demo" : "none";
  if (await createFirstAdmin(db, config, log)) return "admin";
  if (await isEmpty(db)) log.warn("no users and no STILLSPAN_ADMIN_EMAIL/STILLSPAN_ADMIN_PASSWORD: nobody can sign in");
  return "none";
}
