/** `npm run db:start` / `npm run db:stop`: the project's own PostgreSQL cluster, by hand. */
import { loadConfig, projectRoot } from "../config.js";
import { logger } from "../logger.js";
import { createDatabase, ensureLocalPostgres, stopLocalPostgres } from "./pg-local.js";

async function main(command: string | undefined): Promise<void> {
  const config = loadConfig();
  if (command === "start") {
    const cluster = await ensureLocalPostgres({ projectRoot, port: config.pgPort });
    await createDatabase(cluster.url, config.databaseName);
    console.log(`PostgreSQL runs on 127.0.0.1:${cluster.port} (data: ${cluster.dataDir}); database "${config.databaseName}".`);
  } else if (command === "stop") {
    const stopped = await stopLocalPostgres({ projectRoot, port: config.pgPort });
    console.log(stopped ? "PostgreSQL stopped." : "PostgreSQL was not running.");
  } else {
    console.error("usage: tsx server/db/pg-cli.ts start|stop");
    process.exitCode = 2;
  }
}

main(process.argv[2]).catch((err: unknown) => {
  logger.error({ err }, "database command failed");
  console.error(err instanceof Error ? err.message : err);
  process.exitCode = 1;
});
