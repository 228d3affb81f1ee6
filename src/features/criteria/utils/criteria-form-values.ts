import type { FieldErrors, Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { DEFAULT_REQUIREMENTS } from "@shared/criteria/default-requirements";
import {
  PHENOMENA,
  projectCriteriaSchema,
  type Phenomenon,
  type ProjectCriteria,
  type ProjectCriteriaInput,
} from "@shared/schemas/criteria";
import type { TerrainCategory } from "@shared/criteria/terrain-categories";

/**
 * The editor's values. The schema's unions (terrain, probability) and optional multipliers are flattened so
 * that switching a kind or unticking a factor keeps what was typed; `toCriteriaInput` turns them back into the
 * contract's shape, which `criteriaResolver` validates with the shared schema. Field names follow the schema's
 * paths, so the schema's messages land on the right inputs.
 */
export interface MultiplierValues {
  enabled: boolean;
  value: number;
  basis: string;
}

export interface RequirementValues {
  factor: number;
  basis: string;
  gustFactor: MultiplierValues;
  angleFactor: MultiplierValues;
}

export interface CriteriaFormValues {
  wind: {
    basicSpeed: number;
    probability: {
      kind: "return-period" | "annual-probability" | "factor";
      years: number;
      annualProbability: number;
      factor: number;
      basis: string;
    };
    terrain: {
      kind: "category" | "roughness";
      category: TerrainCategory;
      roughnessLength: number;
      minimumHeight: number;
    };
    deckHeight: number;
    orographyFactor: number;
  };
  requirements: Record<Phenomenon, RequirementValues>;
  notes: string;
}

const NO_MULTIPLIER: MultiplierValues = { enabled: false, value: 1, basis: "" };

/** Form values from saved criteria, or a blank start with the default factors. */
export function toFormValues(criteria: ProjectCriteria | null, defaults = DEFAULT_REQUIREMENTS): CriteriaFormValues {
  const wind = criteria?.wind;
  const probability = wind?.probability;
  const terrain = wind?.terrain;
  const requirements = {} as Record<Phenomenon, RequirementValues>;
  for (const phenomenon of PHENOMENA) {
    const requirement = criteria?.requirements[phenomenon] ?? defaults[phenomenon];
    requirements[phenomenon] = {
      factor: requirement.factor,
      basis: requirement.basis,
      gustFactor: requirement.gustFactor ? { enabled: true, ...requirement.gustFactor } : { ...NO_MULTIPLIER },
      angleFactor: requirement.angleFactor ? { enabled: true, ...requirement.angleFactor } : { ...NO_MULTIPLIER },
    };
  }
  return {
    wind: {
      basicSpeed: wind?.basicSpeed ?? Number.NaN,
      probability: {
        kind: probability?.kind ?? "return-period",
        years: probability?.kind === "return-period" ? probability.years : 50,
        annualProbability: probability?.kind === "annual-probability" ? probability.value : 0.02,
        factor: probability?.kind === "factor" ? probability.value : 1,
        basis: probability?.kind === "factor" ? probability.basis : "",
      },
      terrain: {
        kind: terrain?.kind ?? "category",
        category: terrain?.kind === "category" ? terrain.category : "II",
        roughnessLength: terrain?.kind === "roughness" ? terrain.roughnessLength : 0.05,
        minimumHeight: terrain?.kind === "roughness" ? terrain.minimumHeight : 2,
      },
      deckHeight: wind?.deckHeight ?? Number.NaN,
      orographyFactor: wind?.orographyFactor ?? 1,
    },
    requirements,
    notes: criteria?.notes ?? "",
  };
}

/** The contract's shape of the editor's values (not yet validated). */
export function toCriteriaInput(values: CriteriaFormValues): ProjectCriteriaInput {
  const { probability, terrain } = values.wind;
  const requirements = {} as ProjectCriteriaInput["requirements"];
  for (const phenomenon of PHENOMENA) {
    const { factor, basis, gustFactor, angleFactor } = values.requirements[phenomenon];
    requirements[phenomenon] = {
      factor,
      basis,
      ...(gustFactor.enabled ? { gustFactor: { value: gustFactor.value, basis: gustFactor.basis } } : {}),
      ...(angleFactor.enabled ? { angleFactor: { value: angleFactor.value, basis: angleFactor.basis } } : {}),
    };
  }
  return {
    wind: {
      basicSpeed: values.wind.basicSpeed,
      probability:
        probability.kind === "return-period"
          ? { kind: "return-period", years: probability.years }
          : probability.kind === "annual-probability"
            ? { kind: "annual-probability", value: probability.annualProbability }
            : { kind: "factor", value: probability.factor, basis: probability.basis },
      terrain:
        terrain.kind === "category"
          ? { kind: "category", category: terrain.category }
          : { kind: "roughness", roughnessLength: terrain.roughnessLength, minimumHeight: terrain.minimumHeight },
      deckHeight: values.wind.deckHeight,
      orographyFactor: values.wind.orographyFactor,
    },
    requirements,
    ...(values.notes.trim() ? { notes: values.notes } : {}),
  };
}

const schemaResolver = zodResolver(projectCriteriaSchema);

/**
 * Validates the editor's values with the shared schema (the server runs the same one). The schema's
 * `wind.probability.value` belongs to whichever probability input is showing, so its error is moved there.
 */
export const criteriaResolver: Resolver<CriteriaFormValues, unknown, ProjectCriteria> = async (values, context, options) => {
  const result = await schemaResolver(
    toCriteriaInput(values),
    context,
    options as unknown as Parameters<typeof schemaResolver>[2],
  );
  if (Object.keys(result.errors).length === 0) {
    return { values: result.values as ProjectCriteria, errors: {} };
  }
  const errors = result.errors as FieldErrors<CriteriaFormValues> & {
    wind?: { probability?: { value?: unknown } };
  };
  const probabilityErrors = errors.wind?.probability as Record<string, unknown> | undefined;
  if (probabilityErrors && "value" in probabilityErrors) {
    const target = values.wind.probability.kind === "annual-probability" ? "annualProbability" : "factor";
    probabilityErrors[target] = probabilityErrors.value;
    delete probabilityErrors.value;
  }
  return { values: {}, errors: errors as FieldErrors<CriteriaFormValues> };
};
