import type { ChildProcess } from "node:child_process";

/**
 * Stops a child started with `detached: true` together with everything it started (its whole process group):
 * SIGTERM first, SIGKILL if the group is still there after 5 s. Resolves once the child has exited, or at once
 * when it had already gone (or was never started).
 */
export function stopProcessGroup(child: ChildProcess | undefined): Promise<void> {
  if (!child?.pid || child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  const pid = child.pid;
  return new Promise((resolve) => {
    const force = setTimeout(() => {
      try {
        process.kill(-pid, "SIGKILL");
      } catch {
        /* already gone */
      }
    }, 5000);
    child.once("exit", () => {
      clearTimeout(force);
      resolve();
    });
    try {
      process.kill(-pid, "SIGTERM");
    } catch {
      clearTimeout(force);
      resolve();
    }
  });
}
