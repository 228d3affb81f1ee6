/** Direct access to the test database, for arranging data the API cannot create yet and checking what it wrote. */
import { sql } from "drizzle-orm";
import { createDb, type Db } from "../../server/db/client.js";
import { findUserByEmail } from "../../server/db/queries/users.js";
import { memberships, projects, type ProjectRole } from "../../server/db/schema/index.js";
import { testEnv } from "./env.js";

export function openTestDb(): Db {
  return createDb(testEnv.databaseUrl, { max: 2 });
}

export async function userId(db: Db, email: string): Promise<number> {
  const user = await findUserByEmail(db, email);
  if (!user) throw new Error(`no user ${email} in the test database (is the demo seed loaded?)`);
  return user.id;
}

/** A fresh project with the given demo users as members; returns its id. */
export async function createProjectWithMembers(db: Db, name: string, members: Record<string, ProjectRole>): Promise<number> {
  const [project] = await db
    .insert(projects)
    .values({ name, description: "Created by an API test.", siteNotes: "" })
    .returning({ id: projects.id });
  for (const [email, role] of Object.entries(members)) {
    await db.insert(memberships).values({ projectId: project.id, userId: await userId(db, email), role });
  }
  return project.id;
}

export async function auditActions(db: Db, objectType: string, objectId: string | number): Promise<string[]> {
  const { rows } = await db.execute<{ action: string }>(
    sql`select action from audit_events where object_type = ${objectType} and object_id = ${String(objectId)} order by id`,
  );
  return rows.map((r) => r.action);
}

/** The id (as the API spells it: a string) of the project with this exact name. */
export async function projectIdByName(db: Db, name: string): Promise<string> {
  const { rows } = await db.execute<{ id: number }>(sql`select id from projects where name = ${name}`);
  if (rows.length !== 1) throw new Error(`expected one project named ${name}, found ${rows.length}`);
  return String(rows[0].id);
}

/** A user's memberships as the API spells them ({projectId: string, role}). */
export async function membershipsOf(db: Db, userIdValue: number): Promise<{ projectId: string; role: ProjectRole }[]> {
  const { rows } = await db.execute<{ project_id: number; role: ProjectRole }>(
    sql`select project_id, role from memberships where user_id = ${userIdValue} order by project_id`,
  );
  return rows.map((r) => ({ projectId: String(r.project_id), role: r.role }));
}
