import type { RequiredSpeeds } from "@shared/criteria/required-speeds";
import { PHENOMENA, type BasisStatus, type Phenomenon } from "@shared/schemas/criteria";
import { Button } from "@/components/ui/button";
import { BasisStatusNote } from "@/features/criteria/components/basis-status-note";
import { PHENOMENON_LABEL } from "@/features/criteria/components/phenomenon-labels";
import { SourceBadge } from "@/features/criteria/components/source-badge";
import { fixed, sig } from "@/features/criteria/utils/format";

interface RequiredSpeedsTableProps {
  required: RequiredSpeeds;
  meanSpeedMps: number;
  /** The saved version's basis states (who confirmed each); absent in the editor's preview. */
  bases?: Record<Phenomenon, BasisStatus> | null;
  /** Criteria owners confirm an unconfirmed basis as it stands (a new criteria version). */
  onConfirm?: (phenomenon: Phenomenon) => void;
  confirming?: Phenomenon | null;
}

/**
 * The speed each critical speed must reach: factor × gust × angle × v_m, with the basis of every factor and, for a
 * saved version, who stands behind it.
 */
export function RequiredSpeedsTable({ required, meanSpeedMps, bases, onConfirm, confirming = null }: RequiredSpeedsTableProps) {
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Required speeds per phenomenon</caption>
        <thead>
          <tr className="border-b border-ink-200 text-left text-xs tracking-wide text-ink-600 uppercase">
            <th scope="col" className="py-1 pr-3 font-semibold">Phenomenon</th>
            <th scope="col" className="py-1 pr-3 font-semibold">Factor</th>
            <th scope="col" className="py-1 pr-3 text-right font-semibold">Required speed</th>
            <th scope="col" className="py-1 font-semibold">Basis</th>
          </tr>
        </thead>
        <tbody>
          {PHENOMENA.map((phenomenon) => {
            const row = required[phenomenon];
            const parts = [sig(row.factor)];
            if (row.gustFactor !== null) parts.push(`${sig(row.gustFactor)} gust`);
            if (row.angleFactor !== null) parts.push(`${sig(row.angleFactor)} angle`);
            return (
              <tr key={phenomenon} data-phenomenon={phenomenon} className="border-b border-ink-100 align-top last:border-b-0">
                <th scope="row" className="py-1.5 pr-3 text-left font-semibold whitespace-nowrap text-ink-900">
                  {PHENOMENON_LABEL[phenomenon]}
                </th>
                <td className="num py-1.5 pr-3 whitespace-nowrap text-ink-800">
                  {parts.join(" × ")}
                  {parts.length > 1 ? ` = ${sig(row.totalFactor)}` : ""} × v_m
                </td>
                <td
                  data-testid={`required-${phenomenon}`}
                  className="num py-1.5 pr-3 text-right font-semibold whitespace-nowrap text-ink-950"
                  title={`${sig(row.totalFactor)} × ${fixed(meanSpeedMps, 2)} m/s`}
                >
                  {fixed(row.requiredSpeedMps, 2)} m/s
                </td>
                <td className="py-1.5 text-ink-700">
                  <ul className="space-y-0.5">
                    {row.basis.map((basis) => (
                      <li key={basis}>
                        {basis} <SourceBadge text={basis} />
                      </li>
                    ))}
                  </ul>
                  {bases ? (
                    <div className="mt-1 flex flex-wrap items-center gap-2" data-testid={`basis-state-${phenomenon}`}>
                      <BasisStatusNote status={bases[phenomenon]} />
                      {onConfirm && !bases[phenomenon].confirmation ? (
                        <Button
                          size="sm"
                          variant="secondary"
                          isLoading={confirming === phenomenon}
                          disabled={confirming !== null}
                          onClick={() => onConfirm(phenomenon)}
                        >
                          Confirm the {PHENOMENON_LABEL[phenomenon].toLowerCase()} basis
                        </Button>
                      ) : null}
                    </div>
                  ) : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
