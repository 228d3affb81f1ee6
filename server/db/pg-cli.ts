/**
 * `npm run db:start` / `npm run db:stop`: the project's own PostgreSQL cluster, by hand. A cluster started (or
 * found running) by db:start stays when an `npm start` that uses it ends; db:stop stops it.
 */
import { ConfigError, loadConfig, projectRoot } from "../config.js";
import { StartupError } from "../errors.js";
import { logger } from "../logger.js";
import { createDatabase, ensureLocalPostgres, keepLocalPostgres, stopLocalPostgres } from "./pg-local.js";
import { OWNER_ROLE } from "./pg-roles.js";

async function main(command: string | undefined): Promise<void> {
  const config = loadConfig();
  const where = { projectRoot, port: config.pgPort, portIsDefault: !config.pgPortExplicit, dataDir: config.dataDir };
  if (command === "start") {
    const cluster = await ensureLocalPostgres(where);
    keepLocalPostgres(cluster);
    await createDatabase(cluster.url, config.databaseName, OWNER_ROLE);
    console.log(
      `PostgreSQL runs on 127.0.0.1:${cluster.port} (data: ${cluster.dataDir}); database "${config.databaseName}". ` +
        "It keeps running until npm run db:stop.",
    );
  } else if (command === "stop") {
    const stopped = await stopLocalPostgres(where);
    console.log(stopped ? "PostgreSQL stopped." : "PostgreSQL was not running.");
  } else {
    console.error("usage: tsx server/db/pg-cli.ts start|stop");
    process.exitCode = 2;
  }
}

main(process.argv[2]).catch((err: unknown) => {
  if (err instanceof StartupError || err instanceof ConfigError) {
    console.error(err.message);
  } else {
    logger.error({ err }, "database command failed");
    console.error(err instanceof Error ? err.message : err);
  }
  process.exitCode = 1;
});
