import { asc, eq, sql } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import { memberships, projects, users, type NewUser, type ProjectRole, type User } from "../schema/index.js";

/** Case-insensitive e-mail lookup (the unique index is on lower(email)). */
export async function findUserByEmail(db: DbOrTx, email: string): Promise<User | undefined> {
  const [row] = await db
    .select()
    .from(users)
    .where(sql`lower(${users.email}) = ${email.trim().toLowerCase()}`)
    .limit(1);
  return row;
}

export async function findUserById(db: DbOrTx, id: number): Promise<User | undefined> {
  const [row] = await db.select().from(users).where(eq(users.id, id)).limit(1);
  return row;
}

export async function listMembershipsOfUser(
  db: DbOrTx,
  userId: number,
): Promise<{ projectId: number; role: ProjectRole }[]> {
  return db
    .select({ projectId: memberships.projectId, role: memberships.role })
    .from(memberships)
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.projectId));
}

export async function insertUser(db: DbOrTx, user: NewUser): Promise<User> {
  const [row] = await db
    .insert(users)
    .values({ ...user, email: user.email.trim().toLowerCase() })
    .returning();
  return row;
}

/** Every account, by name then e-mail. */
export async function listAllUsers(db: DbOrTx): Promise<User[]> {
  return db.select().from(users).orderBy(asc(users.name), asc(users.email));
}

/** Memberships with the project's name (for the administration page): every account's, or one account's. */
export async function listMembershipsWithProject(
  db: DbOrTx,
  userId?: number,
): Promise<{ userId: number; projectId: number; projectName: string; role: ProjectRole }[]> {
  return db
    .select({ userId: memberships.userId, projectId: projects.id, projectName: projects.name, role: memberships.role })
    .from(memberships)
    .innerJoin(projects, eq(projects.id, memberships.projectId))
    .where(userId === undefined ? undefined : eq(memberships.userId, userId))
    .orderBy(asc(projects.name), asc(projects.id));
}

/** Locks the account row until the transaction ends. */
export async function lockUser(db: DbOrTx, id: number): Promise<User | undefined> {
  const [row] = await db.select().from(users).where(eq(users.id, id)).for("update").limit(1);
  return row;
}

export async function updateUserFields(
  db: DbOrTx,
  id: number,
  patch: Partial<Pick<User, "name" | "isAdmin">>,
): Promise<User | undefined> {
  const [row] = await db
    .update(users)
    .set({ ...patch, updatedAt: new Date() })
    .where(eq(users.id, id))
    .returning();
  return row;
}

/**
 * Sets a new password and ends every session started before now (their `iat` is earlier than
 * `sessions_valid_after`); sessions started from `now` on stay valid.
 */
export async function setPassword(db: DbOrTx, id: number, passwordHash: string, now = new Date()): Promise<void> {
  await db.update(users).set({ passwordHash, updatedAt: now, sessionsValidAfter: now }).where(eq(users.id, id));
}
