import { useWatch, type Control, type FieldErrors, type UseFormRegister } from "react-hook-form";
import type { Phenomenon, ProjectCriteria } from "@shared/schemas/criteria";
import { Field } from "@/components/ui/field";
import { PHENOMENON_LABEL } from "@/features/criteria/components/phenomenon-labels";
import { SourceBadge } from "@/features/criteria/components/source-badge";
import { TextAreaField } from "@/components/ui/textarea-field";
import type { CriteriaFormValues } from "@/features/criteria/utils/criteria-form-values";

interface RequirementFieldsProps {
  phenomenon: Phenomenon;
  control: Control<CriteriaFormValues, unknown, ProjectCriteria>;
  register: UseFormRegister<CriteriaFormValues>;
  errors: FieldErrors<CriteriaFormValues>;
}

const MULTIPLIERS = [
  { key: "gustFactor", label: "Gust / span factor" },
  { key: "angleFactor", label: "Angle-of-attack factor" },
] as const;

/** Factor on v_m for one phenomenon, its basis, and the optional gust and angle multipliers with theirs. */
export function RequirementFields({ phenomenon, control, register, errors }: RequirementFieldsProps) {
  const name = `requirements.${phenomenon}` as const;
  const values = useWatch({ control, name });
  const fieldErrors = errors.requirements?.[phenomenon];
  const label = PHENOMENON_LABEL[phenomenon];
  return (
    <fieldset className="space-y-2 rounded-md border border-ink-200 bg-white px-3 pt-1 pb-3">
      <legend className="px-1 text-sm font-semibold text-ink-900">{label}</legend>
      <div className="grid gap-2 sm:grid-cols-[9rem_minmax(0,1fr)]">
        <Field
          label={`${label} factor`}
          unit="× v_m"
          type="number"
          step="any"
          inputMode="decimal"
          error={fieldErrors?.factor?.message}
          {...register(`${name}.factor`, { valueAsNumber: true })}
        />
        <TextAreaField
          label={
            <>
              Basis of the {label.toLowerCase()} factor <SourceBadge text={values?.basis ?? ""} />
            </>
          }
          rows={3}
          error={fieldErrors?.basis?.message}
          {...register(`${name}.basis`)}
        />
      </div>
      {MULTIPLIERS.map(({ key, label: multiplierLabel }) => {
        const enabled = values?.[key]?.enabled ?? false;
        const multiplierErrors = fieldErrors?.[key];
        return (
          <div key={key} className="space-y-2">
            <label className="flex w-fit items-center gap-2 text-sm text-ink-800">
              <input type="checkbox" className="size-4 accent-tide-600" {...register(`${name}.${key}.enabled`)} />
              {multiplierLabel} on {label.toLowerCase()}
            </label>
            {enabled ? (
              <div className="grid gap-2 sm:grid-cols-[9rem_minmax(0,1fr)]">
                <Field
                  label={`${multiplierLabel} value`}
                  unit="×"
                  type="number"
                  step="any"
                  inputMode="decimal"
                  error={multiplierErrors?.value?.message}
                  {...register(`${name}.${key}.value`, { valueAsNumber: true })}
                />
                <TextAreaField
                  label={`Basis of the ${multiplierLabel.toLowerCase()}`}
                  rows={2}
                  error={multiplierErrors?.basis?.message}
                  {...register(`${name}.${key}.basis`)}
                />
              </div>
            ) : null}
          </div>
        );
      })}
    </fieldset>
  );
}
