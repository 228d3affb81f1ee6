import type { StudyAerodynamics } from "../../schemas/study";
import { createFlatPlateModel } from "./flat-plate";
import { createQuasiSteadyModel } from "./quasi-steady";
import { createTabulatedModel } from "./tabulated";
import type { AeroModel } from "./types";

/**
 * The aerodynamic model a study's `aerodynamics` block asks for.
 *
 * Method: dispatch on `model` — "flat-plate" → Theodorsen's thin plate (`createFlatPlateModel`),
 * "quasi-steady" → static coefficients (`createQuasiSteadyModel`), "tabulated" → measured derivatives
 * interpolated in Ur (`createTabulatedModel`).
 *
 * Notes: the block should have passed `studyAerodynamicsSchema`; the models still check their own inputs and
 * throw a RangeError with a plain message. Each call returns a fresh model (models keep small scratch state,
 * so give each concurrent sweep its own).
 *
 * @param aerodynamics - the study's aerodynamics block (study convention: full width B, h down, α nose-up)
 * @returns the model evaluated by the solver
 */
export function createAeroModel(aerodynamics: StudyAerodynamics): AeroModel {
  switch (aerodynamics.model) {
    case "flat-plate":
      return createFlatPlateModel();
    case "quasi-steady":
      return createQuasiSteadyModel(aerodynamics);
    case "tabulated":
      return createTabulatedModel(aerodynamics);
  }
}
