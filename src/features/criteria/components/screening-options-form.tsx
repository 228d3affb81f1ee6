import { useForm } from "react-hook-form";
import type { ScreeningOptions } from "@shared/schemas/criteria";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import {
  screeningOptionsResolver,
  toOptionsValues,
  type ScreeningOptionsValues,
} from "@/features/criteria/utils/screening-options-values";

interface ScreeningOptionsFormProps {
  value: ScreeningOptions;
  onApply: (options: ScreeningOptions) => void;
  disabled?: boolean;
}

const numberInput = { type: "text", inputMode: "decimal", autoComplete: "off", spellCheck: false } as const;

/**
 * Measured values that replace the screening's defaults: St of the deck section, a_G, and static coefficients
 * (Den Hartog, divergence). Empty fields keep the rectangle tables and the study's own aerodynamic data.
 */
export function ScreeningOptionsForm({ value, onApply, disabled }: ScreeningOptionsFormProps) {
  const {
    register,
    handleSubmit,
    reset,
    formState: { errors, isDirty },
  } = useForm<ScreeningOptionsValues, unknown, ScreeningOptions>({
    resolver: screeningOptionsResolver,
    defaultValues: toOptionsValues(value),
  });
  const given = Object.keys(value).length > 0;

  return (
    <details className="rounded-md border border-ink-200 bg-white px-3 py-2 text-sm" open={given || undefined}>
      <summary className="w-fit cursor-pointer font-semibold text-tide-700 hover:underline">
        Measured values for the screening{given ? " (in use)" : ""}
      </summary>
      <form
        noValidate
        aria-label="Measured values for the screening"
        className="mt-2 space-y-3"
        onSubmit={handleSubmit((options) => {
          onApply(options);
          reset(toOptionsValues(options));
        })}
      >
        <div className="grid gap-3 sm:grid-cols-[8rem_minmax(0,1fr)]">
          <Field label="Strouhal number St" hint="On the deck depth D." error={errors.strouhalNumber?.message} {...numberInput} {...register("strouhalNumber")} />
          <Field label="Source of St" error={errors.strouhalBasis?.message} {...register("strouhalBasis")} />
          <Field
            label="Galloping factor a_G"
            hint="For a deck section no a_G is assumed."
            error={errors.gallopingFactor?.message}
            {...numberInput}
            {...register("gallopingFactor")}
          />
          <Field label="Source of a_G" error={errors.gallopingFactorBasis?.message} {...register("gallopingFactorBasis")} />
        </div>
        <fieldset className="grid gap-3 sm:grid-cols-3">
          <legend className="mb-1 text-ink-700">Static lift and drag coefficients at the mean angle, on ½ρU²B</legend>
          <Field label="dC_L/dα" unit="/rad" error={errors.liftSlope?.message} {...numberInput} {...register("liftSlope")} />
          <Field label="C_D" error={errors.dragCoefficient?.message} {...numberInput} {...register("dragCoefficient")} />
        </fieldset>
        <div className="flex flex-wrap gap-2">
          <Button type="submit" size="sm" disabled={disabled || !isDirty}>
            Screen with these values
          </Button>
          {given ? (
            <Button
              size="sm"
              variant="secondary"
              disabled={disabled}
              onClick={() => {
                onApply({});
                reset(toOptionsValues({}));
              }}
            >
              Back to tables and study data
            </Button>
          ) : null}
        </div>
      </form>
    </details>
  );
}
