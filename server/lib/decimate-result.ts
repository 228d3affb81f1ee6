import type { SweepResult, SweepStep, SweepWarning } from "../../shared/schemas/result.js";

/** Most steps one branch carries in an API answer or a stored revision. */
const MAX_SHOWN_STEPS_PER_BRANCH = 2000;
/** Fewest steps a branch is thinned to, however many branches there are. */
const MIN_SHOWN_STEPS_PER_BRANCH = 100;
/** What the branches of one answer may take as JSON, bytes (the answer stays under about 2 MB with warnings). */
const BRANCHES_JSON_BUDGET_BYTES = 1_600_000;
/** Steps kept on each side of a critical speed, so the crossing and the refined steps around it stay visible. */
const CRITICAL_NEIGHBOURS = 10;
/** Speeds listed per warning, and warnings kept per code. */
const MAX_WARNING_SPEEDS = 200;
const MAX_WARNINGS_PER_CODE = 50;

/**
 * Steps per branch a result may carry: 2,000, fewer with more than four branches (one step's JSON is about
 * 200 bytes plus 30 per branch, for its participation), never fewer than 100.
 */
export function maxShownSteps(branches: number): number {
  const stepBytes = 200 + 30 * branches;
  const fit = Math.floor(BRANCHES_JSON_BUDGET_BYTES / (Math.max(branches, 1) * stepBytes));
  return Math.max(MIN_SHOWN_STEPS_PER_BRANCH, Math.min(MAX_SHOWN_STEPS_PER_BRANCH, fit));
}

/**
 * A sweep result bounded for an answer or a revision row: every branch thinned to `maxShownSteps` steps (the same
 * speeds on every branch), long warning speed lists shortened, and `sampling` saying how many steps were solved
 * and how many are shown. Flutter, divergence and Selberg's estimate are untouched.
 *
 * Which steps stay, in this order until half the allowance is used: the first and last speed and
 * `CRITICAL_NEIGHBOURS` steps on each side of every critical speed (flutter, divergence, static crossings, an
 * unstable start); on every branch both steps around each change of sign of the damping and each change between
 * oscillating and static pole, and the ends of extrapolated ranges; then turning points of damping and
 * frequency and the speeds where tracking was poor. The rest of the allowance is spread half evenly over the
 * speed range and half evenly over the solved steps (which keeps part of the local refinement's density).
 * Every kept step is the solved step itself, never an interpolation.
 */
export function decimateResult(result: SweepResult): SweepResult {
  const limit = maxShownSteps(result.modes.length);
  const solved = result.modes[0]?.steps.length ?? 0;
  const sameSpeeds = result.modes.every((m) => m.steps.length === solved);
  let modes = result.modes;
  let shown = solved;
  if (solved > limit && sameSpeeds) {
    const keep = selectSteps(result, limit);
    modes = result.modes.map((m) => ({ id: m.id, steps: keep.map((k) => m.steps[k]) }));
    shown = keep.length;
  } else if (!sameSpeeds) {
    // Not produced by the engine (its branches share one list of speeds); thin each branch on its own.
    modes = result.modes.map((m) => {
      const keep = m.steps.length > limit ? selectSteps({ ...result, modes: [m] }, limit) : null;
      return keep ? { id: m.id, steps: keep.map((k) => m.steps[k]) } : m;
    });
    shown = Math.max(0, ...modes.map((m) => m.steps.length));
  }
  const { warnings, omitted } = boundWarnings(result.warnings);
  return {
    ...result,
    modes,
    warnings,
    sampling: {
      solvedSteps: solved,
      shownSteps: shown,
      maxShownSteps: limit,
      ...(omitted > 0 ? { omittedWarnings: omitted } : {}),
    },
  };
}

/** Sorted indices of the steps to keep (at most `limit`). */
function selectSteps(result: SweepResult, limit: number): number[] {
  const steps = result.modes[0].steps;
  const n = steps.length;
  const speedAt = (k: number) => steps[k].speed;
  const keep = new Set<number>();
  const featureRoom = Math.floor(limit / 2);
  const addAll = (indices: number[]) => {
    const room = featureRoom - keep.size;
    if (room <= 0) return;
    const fresh = [...new Set(indices)].filter((k) => k >= 0 && k < n && !keep.has(k)).sort((a, b) => a - b);
    for (const k of evenly(fresh, room)) keep.add(k);
  };

  const around = (speed: number) => {
    const k = nearestIndex(steps, speed);
    return Array.from({ length: 2 * CRITICAL_NEIGHBOURS + 1 }, (_, i) => k - CRITICAL_NEIGHBOURS + i);
  };
  const critical = [result.flutter?.speed, result.divergence?.speed].filter((u): u is number => u !== undefined);
  for (const w of result.warnings) {
    if (w.code === "static-instability" || w.code === "unstable-at-start") critical.push(...(w.speeds ?? []));
  }
  addAll([0, n - 1, ...critical.flatMap(around)]);

  const changes: number[] = [];
  const turns: number[] = [];
  for (const mode of result.modes) {
    const s = mode.steps;
    for (let k = 0; k + 1 < n; k++) {
      if (Math.sign(s[k].damping) !== Math.sign(s[k + 1].damping) || (s[k].im === 0) !== (s[k + 1].im === 0)) {
        changes.push(k, k + 1);
      }
      if (k > 0 && (isTurn(s[k - 1].damping, s[k].damping, s[k + 1].damping) || isTurn(s[k - 1].frequency, s[k].frequency, s[k + 1].frequency))) {
        turns.push(k);
      }
      if (s[k].mac < 0.9 || s[k].confidence < 0.5) turns.push(k);
    }
  }
  for (const w of result.warnings) {
    if (w.code === "extrapolated-derivatives") changes.push(...(w.speeds ?? []).map((u) => nearestIndex(steps, u)));
    if (w.code === "tracking-ambiguous" || w.code === "no-convergence") turns.push(...(w.speeds ?? []).map((u) => nearestIndex(steps, u)));
  }
  addAll(changes);
  addAll(turns);

  // The rest: half evenly over the speed range, half evenly over the solved steps.
  const rest = limit - keep.size;
  const bySpeed = Math.ceil(rest / 2);
  const from = speedAt(0);
  const span = speedAt(n - 1) - from;
  for (let i = 0; i < bySpeed; i++) keep.add(nearestIndex(steps, from + ((i + 0.5) / bySpeed) * span));
  const byIndex = limit - keep.size;
  for (let i = 0; i < byIndex; i++) keep.add(Math.round(((i + 0.5) / byIndex) * (n - 1)));
  return [...keep].sort((a, b) => a - b).slice(0, limit);
}

/** At most `count` of the items, spread evenly (all of them when they fit). */
function evenly<T>(items: T[], count: number): T[] {
  if (items.length <= count) return items;
  return Array.from({ length: count }, (_, i) => items[Math.floor(((i + 0.5) * items.length) / count)]);
}

const isTurn = (a: number, b: number, c: number) => (b - a) * (c - b) < 0;

/** Index of the step whose speed is nearest to `speed` (steps sorted by speed). */
function nearestIndex(steps: readonly SweepStep[], speed: number): number {
  let lo = 0;
  let hi = steps.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (steps[mid].speed < speed) lo = mid + 1;
    else hi = mid;
  }
  return lo > 0 && Math.abs(steps[lo - 1].speed - speed) <= Math.abs(steps[lo].speed - speed) ? lo - 1 : lo;
}

/** Warnings with at most 200 speeds each (the total in `speedCount`) and at most 50 of one code. */
function boundWarnings(warnings: readonly SweepWarning[]): { warnings: SweepWarning[]; omitted: number } {
  const perCode = new Map<string, number>();
  const kept: SweepWarning[] = [];
  let omitted = 0;
  for (const w of warnings) {
    const count = (perCode.get(w.code) ?? 0) + 1;
    perCode.set(w.code, count);
    if (count > MAX_WARNINGS_PER_CODE) {
      omitted++;
      continue;
    }
    const speeds = w.speeds;
    kept.push(speeds && speeds.length > MAX_WARNING_SPEEDS ? { ...w, speeds: speeds.slice(0, MAX_WARNING_SPEEDS), speedCount: speeds.length } : w);
  }
  return { warnings: kept, omitted };
}
