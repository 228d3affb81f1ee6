import { unconfirmedBases, unconfirmedBasesMessage } from "@shared/criteria/basis-confirmation";
import type { Phenomenon, ProjectCriteria, ProjectCriteriaDto } from "@shared/schemas/criteria";
import { ErrorPanel } from "@/components/ui/error-panel";
import { ApiError } from "@/lib/api-client";
import { useUpdateCriteria } from "@/features/criteria/api/update-criteria";
import { DesignWindDerivation } from "@/features/criteria/components/design-wind-derivation";
import { RequiredSpeedsTable } from "@/features/criteria/components/required-speeds-table";
import { SourceList } from "@/features/criteria/components/source-badge";
import { sig } from "@/features/criteria/utils/format";

function probabilityText(probability: ProjectCriteria["wind"]["probability"]): string {
  switch (probability.kind) {
    case "return-period":
      return `return period ${sig(probability.years)} years`;
    case "annual-probability":
      return `annual probability of exceedance ${sig(probability.value)}`;
    case "factor":
      return `c_prob = ${sig(probability.value)} given: ${probability.basis}`;
  }
}

function terrainText(terrain: ProjectCriteria["wind"]["terrain"]): string {
  return terrain.kind === "category"
    ? `category ${terrain.category} (EN 1991-1-4 Table 4.1)`
    : `z0 = ${sig(terrain.roughnessLength)} m, z_min = ${sig(terrain.minimumHeight)} m (site values)`;
}

type SavedDto = ProjectCriteriaDto & { criteria: ProjectCriteria; evaluated: NonNullable<ProjectCriteriaDto["evaluated"]> };

/**
 * Confirming a basis as it stands: the same criteria saved again as the next version, with the confirmation
 * recorded (who, when). A stale version answers 409 like any save.
 */
function useConfirmBasis(projectId: string, dto: SavedDto) {
  const update = useUpdateCriteria(projectId);
  const confirm = (phenomenon: Phenomenon) =>
    update.mutate({ criteria: dto.criteria, baseVersion: dto.version, confirmBases: [phenomenon] });
  return { confirm, confirming: update.isPending ? (update.variables?.confirmBases?.[0] ?? null) : null, error: update.error };
}

/** A saved version of the criteria: wind inputs, v_m at deck level, the required speeds and who stands behind each basis. */
export function SavedView({ projectId, dto, canEdit }: { projectId: string; dto: SavedDto; canEdit: boolean }) {
  const { wind, notes } = dto.criteria;
  const { designWind, required } = dto.evaluated;
  const { confirm, confirming, error } = useConfirmBasis(projectId, dto);
  const unconfirmed = dto.bases ? unconfirmedBases(dto.bases) : [];
  return (
    <div className="space-y-4">
      {unconfirmed.length > 0 && dto.version !== null ? (
        <div role="note" aria-label="Criteria not confirmed" className="rounded-md border border-caution-400 bg-caution-100 px-3 py-2 text-sm text-caution-700">
          <p className="font-semibold">No summary can be signed against these criteria yet.</p>
          <p>{unconfirmedBasesMessage(unconfirmed, dto.version)}</p>
        </div>
      ) : null}
      {error ? (
        <ErrorPanel title="The basis was not confirmed" message={error.message} code={error instanceof ApiError ? error.code : undefined} />
      ) : null}
      <div className="grid gap-4 lg:grid-cols-[minmax(14rem,0.8fr)_minmax(0,2fr)]">
        <section aria-label="Wind inputs">
          <h3 className="mb-1 text-sm font-semibold tracking-wide text-ink-600 uppercase">Inputs</h3>
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-[0.95rem]">
            <dt className="text-ink-600">Basic wind speed v_b</dt>
            <dd className="num" data-testid="basic-speed">{sig(wind.basicSpeed)} m/s</dd>
            <dt className="text-ink-600">Probability</dt>
            <dd>{probabilityText(wind.probability)}</dd>
            <dt className="text-ink-600">Terrain</dt>
            <dd>{terrainText(wind.terrain)}</dd>
            <dt className="text-ink-600">Deck height z</dt>
            <dd className="num">{sig(wind.deckHeight)} m</dd>
            <dt className="text-ink-600">Orography c_o</dt>
            <dd className="num">{sig(wind.orographyFactor)}</dd>
          </dl>
        </section>
        <section aria-label="Design wind at deck level">
          <DesignWindDerivation wind={designWind} />
        </section>
      </div>
      <section aria-labelledby="required-speeds-heading" className="space-y-1">
        <h3 id="required-speeds-heading" className="text-sm font-semibold tracking-wide text-ink-600 uppercase">
          Required speeds
        </h3>
        <RequiredSpeedsTable
          required={required}
          meanSpeedMps={designWind.meanSpeedMps}
          bases={dto.bases}
          onConfirm={canEdit ? confirm : undefined}
          confirming={confirming}
        />
      </section>
      {notes ? (
        <section aria-label="Notes on the criteria">
          <h3 className="text-sm font-semibold tracking-wide text-ink-600 uppercase">Notes</h3>
          <p className="max-w-prose whitespace-pre-line text-ink-800">{notes}</p>
        </section>
      ) : null}
      <details className="text-sm">
        <summary className="w-fit cursor-pointer font-semibold text-tide-700 hover:underline">
          Sources of the wind profile
        </summary>
        <SourceList sources={designWind.sources} className="mt-1" />
      </details>
    </div>
  );
}

