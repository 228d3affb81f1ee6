import { STUDY_FORMAT, type StudyDocument } from "@shared/schemas/study";

/**
 * A starting document for a new study of a deck alternative when no earlier study exists to copy: the deck's
 * own width and depth, thin-plate aerodynamics, and structural values that are placeholders only — the name
 * says so, and the analyst replaces them with the deck's own mass, inertia, frequencies and damping.
 */
export function studyTemplate(name: string, deckWidthM: number, deckDepthM: number): StudyDocument {
  return {
    format: STUDY_FORMAT,
    name: `${name} — placeholder structure, replace before use`,
    air: { density: 1.225 },
    deck: { width: deckWidthM, depth: deckDepthM },
    structure: {
      mass: 15_000,
      inertia: 1_500_000,
      modes: [
        { id: "V1", dof: "heave", frequency: 0.1, damping: 0.005 },
        { id: "T1", dof: "torsion", frequency: 0.3, damping: 0.005 },
      ],
    },
    aerodynamics: { model: "flat-plate" },
    sweep: { from: 1, to: 120, step: 0.5 },
  };
}
