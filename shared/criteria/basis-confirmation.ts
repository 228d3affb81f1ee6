import { canonicalJson } from "../canonical-json";
import type { BasisConfirmation, BasisConfirmations, BasisStatus, Phenomenon, ProjectCriteria } from "../schemas/criteria";
import { PHENOMENA } from "../schemas/criteria";
import { DEFAULT_REQUIREMENTS } from "./default-requirements";

type Requirement = ProjectCriteria["requirements"][Phenomenon];

const normalise = (text: string) => text.replace(/\s+/g, " ").trim();
const DEFAULT_TEXTS = new Set(Object.values(DEFAULT_REQUIREMENTS).map((r) => normalise(r.basis)));

/**
 * True when a requirement's basis is one of the texts Stillspan ships as defaults (`DEFAULT_REQUIREMENTS`),
 * whitespace aside. Those texts are starting points recalled from memory, not a project's design basis.
 */
export function isDefaultBasis(text: string): boolean {
  return DEFAULT_TEXTS.has(normalise(text));
}

/** Equal in content: canonical JSON, since a stored version comes back from jsonb with its members reordered. */
const sameRequirement = (a: Requirement | undefined, b: Requirement) => a !== undefined && canonicalJson(a) === canonicalJson(b);

/**
 * The basis confirmations of a new criteria version, per phenomenon. A criteria owner (reviewer or administrator)
 * saves version `version`:
 * - a phenomenon listed in `confirm` is confirmed by the saver now ("confirmed"), whatever its text;
 * - a requirement unchanged from the previous version keeps the previous version's record (who confirmed it, when,
 *   in which version) — or its lack of one;
 * - a changed (or first) requirement whose basis is the saver's own text counts as written by the saver
 *   ("written"): its owner stands behind it by saving it;
 * - otherwise (a default text nobody confirmed) there is no record, and signing stays refused.
 */
export function nextConfirmations(
  previous: { criteria: ProjectCriteria; confirmations: BasisConfirmations } | undefined,
  next: ProjectCriteria,
  confirm: readonly Phenomenon[],
  saver: { id: string; name: string },
  at: string,
  version: number,
): BasisConfirmations {
  const out: BasisConfirmations = {};
  for (const phenomenon of PHENOMENA) {
    const requirement = next.requirements[phenomenon];
    const record = (how: BasisConfirmation["how"]): BasisConfirmation => ({ by: saver, at, version, how });
    if (confirm.includes(phenomenon)) out[phenomenon] = record("confirmed");
    else if (previous && sameRequirement(previous.criteria.requirements[phenomenon], requirement)) {
      const kept = previous.confirmations[phenomenon];
      if (kept) out[phenomenon] = kept;
    } else if (!isDefaultBasis(requirement.basis)) out[phenomenon] = record("written");
  }
  return out;
}

/** Per phenomenon: whether the basis is a shipped default text, and who confirmed or wrote it (null: nobody). */
export function basisStatuses(criteria: ProjectCriteria, confirmations: BasisConfirmations): Record<Phenomenon, BasisStatus> {
  return Object.fromEntries(
    PHENOMENA.map((phenomenon) => [
      phenomenon,
      { defaultText: isDefaultBasis(criteria.requirements[phenomenon].basis), confirmation: confirmations[phenomenon] ?? null },
    ]),
  ) as Record<Phenomenon, BasisStatus>;
}

/** The phenomena whose basis no criteria owner has confirmed or written: a summary cannot be signed on them. */
export function unconfirmedBases(statuses: Record<Phenomenon, BasisStatus>): { phenomenon: Phenomenon; defaultText: boolean }[] {
  return PHENOMENA.filter((p) => statuses[p].confirmation === null).map((phenomenon) => ({
    phenomenon,
    defaultText: statuses[phenomenon].defaultText,
  }));
}

const NAME: Record<Phenomenon, string> = {
  flutter: "flutter",
  divergence: "torsional divergence",
  vortexOnset: "vortex-shedding onset",
  gallopingOnset: "galloping onset",
};

/**
 * One sentence naming the criteria whose basis stands unconfirmed, and what makes a summary signable again — the
 * same words in the API's 409 and on the summary preview.
 */
export function unconfirmedBasesMessage(list: readonly { phenomenon: Phenomenon; defaultText: boolean }[], version: number): string {
  const part = (items: typeof list) => items.map((u) => NAME[u.phenomenon]).join(", ");
  const defaults = list.filter((u) => u.defaultText);
  const others = list.filter((u) => !u.defaultText);
  const clauses = [
    defaults.length > 0 ? `${part(defaults)} still ${defaults.length === 1 ? "has" : "have"} the default basis text` : "",
    others.length > 0 ? `${part(others)} ${others.length === 1 ? "has a basis" : "have bases"} no reviewer confirmed` : "",
  ].filter(Boolean);
  return (
    `In version ${version} of the project's criteria, ${clauses.join("; ")}. A reviewer or administrator must confirm ` +
    "or replace each basis (project page, design wind and criteria) before the summary can be signed."
  );
}
