import { describe, expect, it } from "vitest";
import { DEFAULT_REQUIREMENTS } from "../default-requirements";
import { basisStatuses, isDefaultBasis, nextConfirmations, unconfirmedBases, unconfirmedBasesMessage } from "../basis-confirmation";
import type { ProjectCriteria } from "../../schemas/criteria";

const criteria = (): ProjectCriteria => ({
  wind: { basicSpeed: 28, probability: { kind: "return-period", years: 50 }, terrain: { kind: "category", category: "0" }, deckHeight: 62, orographyFactor: 1 },
  requirements: structuredClone(DEFAULT_REQUIREMENTS),
});
const MIRA = { id: "3", name: "Mira Holloway" };
const ADA = { id: "1", name: "Ada Lindqvist" };

describe("basis confirmations of criteria versions", () => {
  it("knows the shipped default texts, whitespace aside, and nothing else", () => {
    for (const { basis } of Object.values(DEFAULT_REQUIREMENTS)) {
      expect(isDefaultBasis(basis)).toBe(true);
      expect(isDefaultBasis(`  ${basis.replace(/ /g, "  ")}\n`)).toBe(true);
    }
    expect(isDefaultBasis("Owner's specification, clause 5.2 (invented)")).toBe(false);
    expect(isDefaultBasis(`${DEFAULT_REQUIREMENTS.flutter.basis} — checked`)).toBe(false);
  });

  it("leaves the default texts of a first version unconfirmed, so signing is refused on all four", () => {
    const confirmations = nextConfirmations(undefined, criteria(), [], MIRA, "2026-05-01T10:00:00.000Z", 1);
    expect(confirmations).toEqual({});
    const open = unconfirmedBases(basisStatuses(criteria(), confirmations));
    expect(open).toEqual([
      { phenomenon: "flutter", defaultText: true },
      { phenomenon: "divergence", defaultText: true },
      { phenomenon: "vortexOnset", defaultText: true },
      { phenomenon: "gallopingOnset", defaultText: true },
    ]);
    expect(unconfirmedBasesMessage(open, 1)).toBe(
      "In version 1 of the project's criteria, flutter, torsional divergence, vortex-shedding onset, galloping onset still have the " +
        "default basis text. A reviewer or administrator must confirm or replace each basis (project page, design wind and criteria) " +
        "before the summary can be signed.",
    );
  });

  it("records a replaced basis as written and a confirmed default as confirmed, by the saver, in the new version", () => {
    const next = criteria();
    next.requirements.flutter.basis = "Owner's specification, clause 5.2 (invented for the test)";
    const at = "2026-05-01T10:00:00.000Z";
    const confirmations = nextConfirmations(undefined, next, ["divergence"], MIRA, at, 1);
    expect(confirmations).toEqual({
      flutter: { by: MIRA, at, version: 1, how: "written" },
      divergence: { by: MIRA, at, version: 1, how: "confirmed" },
    });
    const statuses = basisStatuses(next, confirmations);
    expect(statuses.divergence).toEqual({ defaultText: true, confirmation: { by: MIRA, at, version: 1, how: "confirmed" } });
    expect(unconfirmedBases(statuses).map((u) => u.phenomenon)).toEqual(["vortexOnset", "gallopingOnset"]);
  });

  it("keeps a confirmation when the stored version comes back with its members in another order", () => {
    const first = criteria();
    const v1 = nextConfirmations(undefined, first, ["flutter"], MIRA, "2026-05-01T10:00:00.000Z", 1);
    // As jsonb returns it: shorter keys first.
    const stored = structuredClone(first);
    stored.requirements.flutter = { basis: first.requirements.flutter.basis, factor: first.requirements.flutter.factor };
    const v2 = nextConfirmations({ criteria: stored, confirmations: v1 }, criteria(), [], ADA, "2026-05-02T10:00:00.000Z", 2);
    expect(v2.flutter).toEqual(v1.flutter);
  });

  it("keeps a confirmation while the requirement is unchanged and drops it when the factor or a multiplier changes", () => {
    const first = criteria();
    const v1 = nextConfirmations(undefined, first, ["flutter", "divergence", "vortexOnset", "gallopingOnset"], MIRA, "2026-05-01T10:00:00.000Z", 1);
    const second = structuredClone(first);
    second.wind.basicSpeed = 30; // the wind is not a basis: every confirmation stays
    second.requirements.divergence.factor = 2.2; // same default text, new factor: nobody confirmed this one
    second.requirements.flutter.gustFactor = { value: 1.1, basis: "Invented gust factor for the test" };
    const v2 = nextConfirmations({ criteria: first, confirmations: v1 }, second, [], ADA, "2026-05-02T10:00:00.000Z", 2);
    expect(v2.vortexOnset).toEqual(v1.vortexOnset);
    expect(v2.gallopingOnset).toEqual(v1.gallopingOnset);
    expect(v2.divergence).toBeUndefined();
    // The flutter requirement changed and its basis is still the default text: not confirmed by saving it.
    expect(v2.flutter).toBeUndefined();
    expect(unconfirmedBasesMessage(unconfirmedBases(basisStatuses(second, v2)), 2)).toMatch(
      /^In version 2 of the project's criteria, flutter, torsional divergence still have the default basis text\./,
    );
  });

  it("names a basis saved before confirmations were recorded as not confirmed, apart from default texts", () => {
    const legacy = criteria();
    legacy.requirements.flutter.basis = "Owner's specification (invented), saved by an analyst before reviewers owned the criteria";
    const open = unconfirmedBases(basisStatuses(legacy, {}));
    expect(unconfirmedBasesMessage(open.slice(0, 2), 4)).toBe(
      "In version 4 of the project's criteria, torsional divergence still has the default basis text; flutter has a basis no " +
        "reviewer confirmed. A reviewer or administrator must confirm or replace each basis (project page, design wind and " +
        "criteria) before the summary can be signed.",
    );
  });
});
