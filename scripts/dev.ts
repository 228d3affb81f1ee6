/**
 * `npm run dev`: the API (tsx watch, restarts on server changes) on PORT (3000) and the Vite dev server (hot
 * reload, proxies /api to the API) on 5173, together. Ctrl-C stops both; if either exits, the other is stopped.
 * The project's PostgreSQL is started here, once, so the API's restarts keep it; it stops with `npm run dev` when
 * this started it.
 */
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { loadConfig } from "../server/config.js";
import { StartupError } from "../server/errors.js";
import { ensureLocalPostgres, keepLocalPostgres, stopLocalPostgres, type LocalPostgres } from "../server/db/pg-local.js";
import { stopProcessGroup } from "./lib/stop-process-group.js";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const bin = (name: string) => path.join(root, "node_modules", ".bin", name);
const port = process.env.PORT ?? "3000";

function start(name: string, cmd: string, args: string[], env: NodeJS.ProcessEnv): ChildProcess {
  // Own process group, so stopping it also stops what it started (tsx's node child, esbuild).
  const child = spawn(cmd, args, { cwd: root, env, stdio: "inherit", detached: true });
  child.on("exit", (code, signal) => {
    if (!stopping) {
      console.log(`[dev] ${name} exited (${signal ?? code}); stopping the rest`);
      void stopAll(code ?? 1);
    }
  });
  return child;
}

let stopping = false;
const children: ChildProcess[] = [];

let cluster: LocalPostgres | undefined;

async function stopAll(code: number): Promise<never> {
  stopping = true;
  await Promise.all(children.map((child) => stopProcessGroup(child)));
  if (cluster?.started) await stopLocalPostgres({ projectRoot: root, port: cluster.port, baseDir: cluster.baseDir }).catch(() => undefined);
  process.exit(code);
}

const config = loadConfig();
if (!config.databaseUrl) {
  try {
    cluster = await ensureLocalPostgres({ projectRoot: root, port: config.pgPort, portIsDefault: !config.pgPortExplicit, dataDir: config.dataDir });
  } catch (err) {
    console.error(`[dev] ${err instanceof StartupError ? err.message : `PostgreSQL did not start: ${(err as Error).message}`}`);
    process.exit(1);
  }
  // The API restarts on every change: marked like db:start, the cluster outlives each restart of the API.
  if (cluster.started) keepLocalPostgres(cluster);
}

children.push(
  start("api", bin("tsx"), ["watch", "--clear-screen=false", "server/main.ts"], {
    ...process.env,
    PORT: port,
    NODE_ENV: "development",
  }),
  start("vite", bin("vite"), [], { ...process.env, PORT: port }),
);
console.log(`[dev] API on http://127.0.0.1:${port}, client with hot reload on http://127.0.0.1:5173 (Ctrl-C stops both)`);
process.on("SIGINT", () => void stopAll(0));
process.on("SIGTERM", () => void stopAll(0));
