// Every table and enum of the database, one file per concern. drizzle.config.ts points here: a table must be
// exported from this file (directly or by re-export) or drizzle-kit silently leaves it out of the migration.
export * from "./users.js";
export * from "./projects.js";
export * from "./audit-events.js";
export * from "./sessions.js";
export * from "./criteria.js";
export * from "./alternatives.js";
export * from "./aero-datasets.js";
export * from "./studies.js";
export * from "./study-revisions.js";
export * from "./study-revision-tables.js";
export * from "./assessments.js";
export * from "./mail.js";
export * from "./review.js";
export * from "./one-time-tokens.js";
