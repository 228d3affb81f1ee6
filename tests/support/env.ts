/** What scripts/test.ts hands the integration tests; a clear error when a test is run without it. */
function required(name: string): string {
  const value = process.env[name];
  if (!value) {
    throw new Error(`${name} is not set: run the integration tests through \`npm test\` (scripts/test.ts), which starts PostgreSQL and the app`);
  }
  return value;
}

export const testEnv = {
  get baseUrl(): string {
    return required("TEST_BASE_URL");
  },
  /** The test database as the owner role (migrations' role): for arranging data and reading what the app wrote. */
  get databaseUrl(): string {
    return required("TEST_DATABASE_URL");
  },
  /** The test database as the app's own role (what the running app connects as). */
  get appDatabaseUrl(): string {
    return required("TEST_APP_DATABASE_URL");
  },
  /** The session secret the app child was started with (lets tests forge expired or foreign tokens). */
  get sessionSecret(): Uint8Array {
    return new TextEncoder().encode(required("TEST_SESSION_SECRET"));
  },
};
