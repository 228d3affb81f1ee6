import { defineConfig } from "drizzle-kit";

// `npm run db:generate` reads the schema and writes SQL migrations to drizzle/ (review and commit them).
// Migrations are applied by the server at start (server/db/migrate.ts), not by drizzle-kit.
export default defineConfig({
  dialect: "postgresql",
  schema: "./server/db/schema/index.ts",
  out: "./drizzle",
  casing: "snake_case",
  strict: true,
  verbose: true,
});
