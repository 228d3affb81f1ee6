import type { Response } from "express";
import type { RunSweep } from "../services/sweep-compute.js";
import type { SweepPool } from "../services/sweep-pool.js";

/**
 * The app's sweep pool bound to one request: its sweeps count against `user`, and they are dropped — taken off
 * the queue, or their worker stopped — when the connection closes before the answer is sent.
 */
export function requestSweeps(pool: SweepPool, user: { id: number }, res: Response): RunSweep {
  const controller = new AbortController();
  res.once("close", () => {
    if (!res.writableFinished) controller.abort();
  });
  return (study, { table }) => pool.run(study, { owner: String(user.id), signal: controller.signal, table });
}
