import { asc, eq, sql } from "drizzle-orm";
import type { DbOrTx } from "../client.js";
import { memberships, users, type NewUser, type ProjectRole, type User } from "../schema/index.js";

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
