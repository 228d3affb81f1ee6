import type { FieldErrors, Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { screeningOptionsSchema, type ScreeningOptions } from "@shared/schemas/criteria";

/**
 * The screening options as typed: text, so that an empty input means "not given" (the table or the study's own
 * data then apply). `toScreeningOptions` drops the empty ones; the shared schema validates the rest.
 */
export interface ScreeningOptionsValues {
  strouhalNumber: string;
  strouhalBasis: string;
  gallopingFactor: string;
  gallopingFactorBasis: string;
  liftSlope: string;
  dragCoefficient: string;
}

const NUMERIC = ["strouhalNumber", "gallopingFactor", "liftSlope", "dragCoefficient"] as const;

export function toOptionsValues(options: ScreeningOptions = {}): ScreeningOptionsValues {
  const text = (value: number | undefined) => (value === undefined ? "" : String(value));
  return {
    strouhalNumber: text(options.strouhalNumber),
    strouhalBasis: options.strouhalBasis ?? "",
    gallopingFactor: text(options.gallopingFactor),
    gallopingFactorBasis: options.gallopingFactorBasis ?? "",
    liftSlope: text(options.liftSlope),
    dragCoefficient: text(options.dragCoefficient),
  };
}

/** Only what was filled in; a number that does not parse stays as its text, so the schema names it. */
export function toScreeningOptions(values: ScreeningOptionsValues): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const key of NUMERIC) {
    const raw = values[key].trim();
    if (raw === "") continue;
    const value = Number(raw.replace(/\s/g, ""));
    out[key] = Number.isFinite(value) ? value : raw;
  }
  if (values.strouhalBasis.trim()) out.strouhalBasis = values.strouhalBasis.trim();
  if (values.gallopingFactorBasis.trim()) out.gallopingFactorBasis = values.gallopingFactorBasis.trim();
  return out;
}

const schemaResolver = zodResolver(screeningOptionsSchema);

/**
 * The shared schema's rules, plus one of the product: a measured St or a chosen a_G must say where it comes from,
 * or the screening could not name its source.
 */
export const screeningOptionsResolver: Resolver<ScreeningOptionsValues, unknown, ScreeningOptions> = async (
  values,
  context,
  options,
) => {
  const result = await schemaResolver(
    toScreeningOptions(values),
    context,
    options as unknown as Parameters<typeof schemaResolver>[2],
  );
  const errors = { ...(result.errors as FieldErrors<ScreeningOptionsValues>) };
  if (values.strouhalNumber.trim() && !values.strouhalBasis.trim() && !errors.strouhalBasis) {
    errors.strouhalBasis = { type: "required", message: "say where the Strouhal number comes from (test report, reference)" };
  }
  if (values.gallopingFactor.trim() && !values.gallopingFactorBasis.trim() && !errors.gallopingFactorBasis) {
    errors.gallopingFactorBasis = { type: "required", message: "say where a_G comes from" };
  }
  if (values.strouhalNumber.trim() && !Number.isFinite(Number(values.strouhalNumber))) {
    errors.strouhalNumber = { type: "type", message: "must be a number" };
  }
  return Object.keys(errors).length === 0
    ? { values: result.values as ScreeningOptions, errors: {} }
    : { values: {}, errors };
};
