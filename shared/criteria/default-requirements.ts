import type { ProjectCriteria } from "../schemas/criteria";
import { SOURCES } from "./sources";

/**
 * Default acceptance factors on the design mean wind at deck level, each with its basis. They are starting
 * points for a project, to be replaced by the governing specification; where a default comes from memory the
 * basis says so.
 */
export const DEFAULT_REQUIREMENTS: ProjectCriteria["requirements"] = {
  flutter: {
    factor: 1.2,
    basis: SOURCES.flutterFactor,
  },
  divergence: {
    factor: 2,
    basis: SOURCES.divergenceCriterion,
  },
  vortexOnset: {
    factor: 1.25,
    basis: SOURCES.vortexCriterion,
  },
  gallopingOnset: {
    factor: 1.25,
    basis: SOURCES.gallopingCriterion,
  },
};
