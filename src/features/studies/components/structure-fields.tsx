import { useWatch, type Control, type FieldErrors, type UseFormRegister } from "react-hook-form";
import type { StudyDocument } from "@shared/schemas/study";
import { dampingWarning } from "@/features/studies/utils/damping-warning";
import { derivedQuantities, type DeepPartial } from "@shared/study-derived-quantities";
import { QuantityField } from "@/features/studies/components/quantity-field";

interface StructureFieldsProps {
  register: UseFormRegister<StudyDocument>;
  control: Control<StudyDocument>;
  errors: FieldErrors<StudyDocument>;
  readOnly: boolean;
}

const fmt = (value: number | null, digits: number) => (value === null ? "—" : value.toFixed(digits));

/**
 * The section model's structure, deck and air: every field with its unit, and the derived quantities an
 * aerodynamicist checks at a glance (frequency ratio, radius of gyration, mass ratio), updated as they type.
 */
export function StructureFields({ register, control, errors, readOnly }: StructureFieldsProps) {
  const values = useWatch({ control }) as DeepPartial<StudyDocument>;
  const derived = derivedQuantities(values);
  const modes = values.structure?.modes ?? [];
  const num = { valueAsNumber: true } as const;

  return (
    <div className="space-y-3">
      <div className="grid grid-cols-2 gap-x-3 gap-y-2 sm:grid-cols-3">
        <QuantityField label="Deck width B" unit="m" readOnly={readOnly} value={values.deck?.width}
          registration={register("deck.width", num)} error={errors.deck?.width?.message} />
        <QuantityField label="Deck depth D" unit="m" readOnly={readOnly} value={values.deck?.depth}
          registration={register("deck.depth", num)} error={errors.deck?.depth?.message} />
        <QuantityField label="Air density ρ" unit="kg/m³" readOnly={readOnly} value={values.air?.density}
          registration={register("air.density", num)} error={errors.air?.density?.message} />
        <QuantityField label="Mass m" unit="kg/m" readOnly={readOnly} value={values.structure?.mass}
          registration={register("structure.mass", num)} error={errors.structure?.mass?.message} />
        <QuantityField label="Inertia I" unit="kg·m²/m" readOnly={readOnly} value={values.structure?.inertia}
          registration={register("structure.inertia", num)} error={errors.structure?.inertia?.message} />
      </div>

      <table className="w-full text-left text-sm">
        <caption className="sr-only">Structural modes</caption>
        <thead>
          <tr className="text-xs tracking-wide text-ink-600 uppercase">
            <th scope="col" className="py-1 pr-2 font-semibold">Mode</th>
            <th scope="col" className="py-1 pr-2 font-semibold">
              Frequency <span className="normal-case">f</span>
            </th>
            <th scope="col" className="py-1 font-semibold">
              {/* Upper case would turn ζ into Ζ, a letter an engineer reads as Z. */}
              Damping <span className="normal-case">ζ</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {modes.map((mode, index) => {
            const modeErrors = errors.structure?.modes?.[index];
            const label = mode?.dof === "torsion" ? "Torsional" : "Vertical (heave)";
            const damping = typeof mode?.damping === "number" && Number.isFinite(mode.damping) ? mode.damping : null;
            const warning = dampingWarning(damping);
            const dampingText = damping !== null ? `${(damping * 100).toFixed(2)} % · δ ${(2 * Math.PI * damping).toFixed(3)}` : undefined;
            return (
              <tr key={index} className="align-top">
                <th scope="row" className="py-1 pr-2 font-semibold text-ink-800">
                  <span className="block">{label}</span>
                  <span className="font-mono text-xs text-ink-600">{mode?.id}</span>
                </th>
                <td className="py-1 pr-2">
                  <QuantityField label={`${label} frequency`} unit="Hz" readOnly={readOnly} value={mode?.frequency}
                    registration={register(`structure.modes.${index}.frequency`, num)}
                    error={modeErrors?.frequency?.message} className="[&_label]:sr-only [&>span:first-child]:sr-only" />
                </td>
                <td className="py-1">
                  <QuantityField label={`${label} damping ratio`} unit="ratio" readOnly={readOnly} value={mode?.damping}
                    registration={register(`structure.modes.${index}.damping`, num)}
                    error={modeErrors?.damping?.message}
                    hint={
                      warning ? (
                        <>
                          {dampingText}
                          <span className="block font-semibold text-caution-700">{warning}</span>
                        </>
                      ) : dampingText
                    }
                    className="[&_label]:sr-only [&>span:first-child]:sr-only" />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {errors.structure?.modes?.root?.message || errors.structure?.modes?.message ? (
        <p className="text-sm font-semibold text-signal-700">
          Modes {errors.structure?.modes?.root?.message ?? errors.structure?.modes?.message}
        </p>
      ) : null}

      <dl aria-label="Derived quantities" className="grid grid-cols-3 gap-2 rounded-md bg-ink-50 px-3 py-2 text-sm">
        <div>
          <dt className="text-ink-600">f<sub>α</sub> / f<sub>h</sub></dt>
          <dd className="num font-semibold" data-testid="frequency-ratio">{fmt(derived.frequencyRatio, 3)}</dd>
        </div>
        <div>
          <dt className="text-ink-600">r = √(I/m)</dt>
          <dd className="num font-semibold">
            {fmt(derived.radiusOfGyrationM, 2)} m
            <span className="ml-1 font-normal text-ink-600">({fmt(derived.radiusOverWidth, 3)} B)</span>
          </dd>
        </div>
        <div>
          <dt className="text-ink-600">μ = m/(ρB²)</dt>
          <dd className="num font-semibold">{fmt(derived.massRatio, 2)}</dd>
        </div>
      </dl>
    </div>
  );
}
