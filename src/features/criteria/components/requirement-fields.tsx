import { useWatch, type Control, type FieldErrors, type UseFormRegister } from "react-hook-form";
import { isDefaultBasis } from "@shared/criteria/basis-confirmation";
import type { BasisStatus, Phenomenon, ProjectCriteria } from "@shared/schemas/criteria";
import { Field } from "@/components/ui/field";
import { BasisStatusNote } from "@/features/criteria/components/basis-status-note";
import { PHENOMENON_LABEL } from "@/features/criteria/components/phenomenon-labels";
import { SourceBadge } from "@/features/criteria/components/source-badge";
import { TextAreaField } from "@/components/ui/textarea-field";
import type { CriteriaFormValues } from "@/features/criteria/utils/criteria-form-values";

interface RequirementFieldsProps {
  phenomenon: Phenomenon;
  control: Control<CriteriaFormValues, unknown, ProjectCriteria>;
  register: UseFormRegister<CriteriaFormValues>;
  errors: FieldErrors<CriteriaFormValues>;
  /** Who stands behind the saved version's basis (null before the first save). */
  status: BasisStatus | null;
  /** The saver confirms this basis as it stands with the new version. */
  confirm: boolean;
  onConfirmChange: (confirm: boolean) => void;
}

const MULTIPLIERS = [
  { key: "gustFactor", label: "Gust / span factor" },
  { key: "angleFactor", label: "Angle-of-attack factor" },
] as const;

/**
 * Factor on v_m for one phenomenon, its basis (marked when it is still a default text) with who stands behind the
 * saved one, the saver's confirmation, and the optional gust and angle multipliers with their bases.
 */
export function RequirementFields({ phenomenon, control, register, errors, status, confirm, onConfirmChange }: RequirementFieldsProps) {
  const name = `requirements.${phenomenon}` as const;
  const values = useWatch({ control, name });
  const fieldErrors = errors.requirements?.[phenomenon];
  const label = PHENOMENON_LABEL[phenomenon];
  return (
    <fieldset className="space-y-2 rounded-md border border-ink-200 bg-white px-3 pt-1 pb-3">
      <legend className="px-1 text-sm font-semibold text-ink-900">{label}</legend>
      {status ? (
        <p>
          <span className="text-xs text-ink-600">Saved basis: </span>
          <BasisStatusNote status={status} />
        </p>
      ) : null}
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
          hint={
            isDefaultBasis(values?.basis ?? "")
              ? "Stillspan's default text, recalled from memory: replace it with the project's basis, or confirm it below."
              : undefined
          }
          {...register(`${name}.basis`)}
        />
      </div>
      <label className="flex w-fit items-center gap-2 text-sm text-ink-800">
        <input type="checkbox" className="size-4 accent-tide-600" checked={confirm} onChange={(e) => onConfirmChange(e.target.checked)} />
        Confirm the {label.toLowerCase()} basis as it stands (recorded with your name)
      </label>
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
