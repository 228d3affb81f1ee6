import type { Config } from "../../config.js";
import type { Logger } from "../../logger.js";
import type { Tx } from "../client.js";

/**
 * What each seed step receives. `refs` carries ids between steps under stable keys ("user:analyst",
 * "project:harrowmere", …) so a later step can attach to what an earlier one made.
 */
export interface SeedContext {
  tx: Tx;
  config: Config;
  log: Logger;
  refs: Map<string, number>;
}

export interface SeedStep {
  /** Short name for the log. */
  name: string;
  run(ctx: SeedContext): Promise<void>;
}

/** The id stored under `key` by an earlier step; throws when the steps are out of order. */
export function ref(ctx: SeedContext, key: string): number {
  const id = ctx.refs.get(key);
  if (id === undefined) throw new Error(`seed: no "${key}" yet — check the order of the steps in seed/steps.ts`);
  return id;
}
