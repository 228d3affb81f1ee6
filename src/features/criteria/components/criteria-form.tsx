import { useEffect, useMemo, useRef, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { evaluateCriteria, type EvaluatedCriteria } from "@shared/criteria/evaluate-criteria";
import { TERRAIN_CATEGORIES, TERRAIN_CATEGORY_IDS, type TerrainCategory } from "@shared/criteria/terrain-categories";
import { formatStudyIssues } from "@shared/schemas/study";
import { PHENOMENA, projectCriteriaSchema, type Phenomenon, type ProjectCriteria, type ProjectCriteriaDto } from "@shared/schemas/criteria";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field } from "@/components/ui/field";
import { SelectField } from "@/components/ui/select-field";
import { TextAreaField } from "@/components/ui/textarea-field";
import { ApiError } from "@/lib/api-client";
import { useUpdateCriteria } from "@/features/criteria/api/update-criteria";
import { DesignWindDerivation } from "@/features/criteria/components/design-wind-derivation";
import { RequirementFields } from "@/features/criteria/components/requirement-fields";
import { RequiredSpeedsTable } from "@/features/criteria/components/required-speeds-table";
import {
  criteriaResolver,
  toCriteriaInput,
  toFormValues,
  type CriteriaFormValues,
} from "@/features/criteria/utils/criteria-form-values";
import { sig } from "@/features/criteria/utils/format";

interface CriteriaFormProps {
  projectId: string;
  current: ProjectCriteriaDto;
  onSaved: (saved: ProjectCriteriaDto) => void;
  onCancel: () => void;
  /** Reloads the saved version after a conflict; the parent remounts the form (keyed by version), dropping the edits. */
  onReload: () => Promise<unknown>;
}

const CUSTOM_TERRAIN = "custom";

/** The live evaluation of what is typed, or the first problem that stops it. */
function usePreview(values: CriteriaFormValues): { evaluated: EvaluatedCriteria } | { problem: string } {
  return useMemo(() => {
    const parsed = projectCriteriaSchema.safeParse(toCriteriaInput(values));
    if (!parsed.success) {
      const [issue] = formatStudyIssues(parsed.error);
      return { problem: issue ? `${issue.path.replace(/^\$\./, "")} ${issue.message}` : "inputs incomplete" };
    }
    try {
      return { evaluated: evaluateCriteria(parsed.data) };
    } catch (error) {
      // A range the schema lets through but a formula does not (the routine says which input and why).
      return { problem: error instanceof Error ? error.message : "the inputs cannot be evaluated" };
    }
  }, [values]);
}

/** The design-wind and criteria editor: validated by the shared schema, previewed live, saved as a new version. */
export function CriteriaForm({ projectId, current, onSaved, onCancel, onReload }: CriteriaFormProps) {
  const defaultValues = useMemo(() => toFormValues(current.criteria, current.defaults), [current]);
  const {
    register,
    control,
    handleSubmit,
    setValue,
    formState: { errors, isDirty },
  } = useForm<CriteriaFormValues, unknown, ProjectCriteria>({
    resolver: criteriaResolver,
    defaultValues,
    mode: "onTouched",
  });
  const update = useUpdateCriteria(projectId, { onSuccess: onSaved });
  const [confirmBases, setConfirmBases] = useState<readonly Phenomenon[]>([]);
  const values = useWatch({ control }) as CriteriaFormValues;
  const preview = usePreview(values);
  const firstField = useRef<HTMLInputElement | null>(null);
  const basicSpeed = register("wind.basicSpeed", { valueAsNumber: true });

  useEffect(() => {
    firstField.current?.focus();
  }, []);

  const conflict = update.error instanceof ApiError && update.error.status === 409 ? update.error : null;
  const terrain = values.wind.terrain;
  const probability = values.wind.probability;
  const windErrors = errors.wind;

  const reload = async () => {
    update.reset();
    await onReload();
  };

  return (
    <form
      noValidate
      aria-label="Edit the design wind and criteria"
      className="space-y-4"
      onSubmit={handleSubmit((criteria) => update.mutate({ criteria, baseVersion: current.version, confirmBases: [...confirmBases] }))}
    >
      {conflict ? (
        <ErrorPanel
          title="Someone saved the criteria meanwhile"
          message={
            <>
              <p>
                Version {current.version ?? "—"} was the latest when you started; a newer version has been saved since.
                Load it to see what changed, then make your edit again — your unsaved changes here are discarded.
              </p>
              <Button variant="secondary" size="sm" className="mt-2" onClick={() => void reload()}>
                Load the latest version
              </Button>
            </>
          }
          code={conflict.code}
        />
      ) : update.isError ? (
        <ErrorPanel
          title="The criteria were not saved"
          message={update.error.message}
          code={update.error instanceof ApiError ? update.error.code : undefined}
        />
      ) : null}

      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.15fr)]">
        <fieldset className="space-y-3">
          <legend className="mb-2 text-sm font-semibold tracking-wide text-ink-600 uppercase">Wind at the site</legend>
          <Field
            label="Basic wind speed v_b"
            unit="m/s"
            type="number"
            step="any"
            inputMode="decimal"
            hint="10-minute mean at 10 m above open terrain (category II), annual exceedance probability 0.02."
            error={windErrors?.basicSpeed?.message}
            {...basicSpeed}
            ref={(element) => {
              basicSpeed.ref(element);
              firstField.current = element;
            }}
          />
          <div className="grid gap-3 sm:grid-cols-2">
            <SelectField label="Probability of the design wind" {...register("wind.probability.kind")}>
              <option value="return-period">Return period</option>
              <option value="annual-probability">Annual probability of exceedance</option>
              <option value="factor">Probability factor given</option>
            </SelectField>
            {probability.kind === "return-period" ? (
              <Field
                label="Return period T"
                unit="years"
                type="number"
                step="any"
                inputMode="decimal"
                error={windErrors?.probability?.years?.message}
                {...register("wind.probability.years", { valueAsNumber: true })}
              />
            ) : probability.kind === "annual-probability" ? (
              <Field
                label="Annual probability p"
                type="number"
                step="any"
                inputMode="decimal"
                error={windErrors?.probability?.annualProbability?.message}
                {...register("wind.probability.annualProbability", { valueAsNumber: true })}
              />
            ) : (
              <Field
                label="Probability factor c_prob"
                type="number"
                step="any"
                inputMode="decimal"
                error={windErrors?.probability?.factor?.message}
                {...register("wind.probability.factor", { valueAsNumber: true })}
              />
            )}
          </div>
          {probability.kind === "factor" ? (
            <TextAreaField
              label="Basis of the probability factor"
              rows={2}
              error={windErrors?.probability?.basis?.message}
              {...register("wind.probability.basis")}
            />
          ) : null}
          <SelectField
            label="Terrain"
            hint="Upwind terrain of EN 1991-1-4 Table 4.1, or the site's own roughness length."
            value={terrain.kind === "category" ? terrain.category : CUSTOM_TERRAIN}
            onChange={(event) => {
              const choice = event.target.value;
              const options = { shouldDirty: true, shouldValidate: false };
              if (choice === CUSTOM_TERRAIN) {
                setValue("wind.terrain.kind", "roughness", options);
              } else {
                setValue("wind.terrain.kind", "category", options);
                setValue("wind.terrain.category", choice as TerrainCategory, options);
              }
            }}
          >
            {TERRAIN_CATEGORY_IDS.map((id) => (
              <option key={id} value={id}>
                Category {id}: z0 = {sig(TERRAIN_CATEGORIES[id].roughnessLengthM)} m, z_min ={" "}
                {sig(TERRAIN_CATEGORIES[id].minimumHeightM)} m — {TERRAIN_CATEGORIES[id].description}
              </option>
            ))}
            <option value={CUSTOM_TERRAIN}>Custom roughness length z0 and minimum height z_min</option>
          </SelectField>
          {terrain.kind === "roughness" ? (
            <div className="grid gap-3 sm:grid-cols-2">
              <Field
                label="Roughness length z0"
                unit="m"
                type="number"
                step="any"
                inputMode="decimal"
                error={windErrors?.terrain?.roughnessLength?.message}
                {...register("wind.terrain.roughnessLength", { valueAsNumber: true })}
              />
              <Field
                label="Minimum height z_min"
                unit="m"
                type="number"
                step="any"
                inputMode="decimal"
                error={windErrors?.terrain?.minimumHeight?.message}
                {...register("wind.terrain.minimumHeight", { valueAsNumber: true })}
              />
            </div>
          ) : null}
          <div className="grid gap-3 sm:grid-cols-2">
            <Field
              label="Deck height z"
              unit="m"
              type="number"
              step="any"
              inputMode="decimal"
              hint="Above ground or water; at most 200 m."
              error={windErrors?.deckHeight?.message}
              {...register("wind.deckHeight", { valueAsNumber: true })}
            />
            <Field
              label="Orography factor c_o"
              type="number"
              step="any"
              inputMode="decimal"
              hint="1 for flat terrain or open water (§4.3.3)."
              error={windErrors?.orographyFactor?.message}
              {...register("wind.orographyFactor", { valueAsNumber: true })}
            />
          </div>
        </fieldset>

        <section aria-label="Preview of the design wind" className="space-y-2">
          <h3 className="text-sm font-semibold tracking-wide text-ink-600 uppercase">Preview (not saved)</h3>
          {"evaluated" in preview ? (
            <>
              <DesignWindDerivation wind={preview.evaluated.designWind} live />
              <RequiredSpeedsTable required={preview.evaluated.required} meanSpeedMps={preview.evaluated.designWind.meanSpeedMps} />
            </>
          ) : (
            <p role="status" className="rounded-md border border-caution-400 bg-caution-100 px-3 py-2 text-sm text-caution-700">
              Preview paused: {preview.problem}.
            </p>
          )}
        </section>
      </div>

      <fieldset className="space-y-3">
        <legend className="mb-2 text-sm font-semibold tracking-wide text-ink-600 uppercase">
          Required speeds: a factor on the design speed per phenomenon
        </legend>
        <div className="grid gap-3 xl:grid-cols-2">
          {PHENOMENA.map((phenomenon) => (
            <RequirementFields
              key={phenomenon}
              phenomenon={phenomenon}
              control={control}
              register={register}
              errors={errors}
              status={current.bases?.[phenomenon] ?? null}
              confirm={confirmBases.includes(phenomenon)}
              onConfirmChange={(on) =>
                setConfirmBases((list) => (on ? [...list, phenomenon] : list.filter((p) => p !== phenomenon)))
              }
            />
          ))}
        </div>
      </fieldset>

      <TextAreaField
        label="Notes on the criteria"
        hint="Governing specification, National Annex, agreements with the owner."
        rows={3}
        error={errors.notes?.message}
        {...register("notes")}
      />

      <div className="flex flex-wrap items-center gap-2 border-t border-ink-100 pt-3">
        <Button type="submit" isLoading={update.isPending} disabled={conflict !== null}>
          Save as version {(current.version ?? 0) + 1}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        {!isDirty && confirmBases.length === 0 ? <span className="text-sm text-ink-600">No changes yet.</span> : null}
      </div>
    </form>
  );
}
