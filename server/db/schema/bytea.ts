import { customType } from "drizzle-orm/pg-core";

/** PostgreSQL `bytea` as a Node Buffer (drizzle-orm has no built-in column for it). */
export const bytea = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => "bytea",
});
