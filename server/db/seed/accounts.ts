import { users } from "../schema/index.js";
import { hashPassword } from "../../services/passwords.js";
import type { SeedStep } from "./types.js";

/** Shared password of the demo accounts (demo seed only; printed at start and in the README). */
export const DEMO_PASSWORD = "stillspan-demo";

export const DEMO_ACCOUNTS = [
  { key: "admin", email: "admin@stillspan.test", name: "Ada Quillfeather", isAdmin: true, label: "admin" },
  { key: "analyst", email: "analyst@stillspan.test", name: "Tomas Reedwell", isAdmin: false, label: "analyst" },
  { key: "reviewer", email: "reviewer@stillspan.test", name: "Mira Holloway", isAdmin: false, label: "reviewer (senior engineer)" },
  { key: "viewer", email: "viewer@stillspan.test", name: "Owen Farrant", isAdmin: false, label: "viewer (owner's representative)" },
] as const;

/** The four demo accounts; ids under "user:<key>". */
export const demoAccounts: SeedStep = {
  name: "demo accounts",
  async run({ tx, refs }) {
    for (const account of DEMO_ACCOUNTS) {
      const [row] = await tx
        .insert(users)
        .values({
          email: account.email,
          name: account.name,
          isAdmin: account.isAdmin,
          passwordHash: await hashPassword(DEMO_PASSWORD),
        })
        .returning({ id: users.id });
      refs.set(`user:${account.key}`, row.id);
    }
  },
};
