import { cleanup, fireEvent, render, screen } from "@testing-library/react";
import { useForm } from "react-hook-form";
import { afterEach, describe, expect, it } from "vitest";
import type { StudyDocument } from "@shared/schemas/study";
import { StructureFields } from "@/features/studies/components/structure-fields";
import { studyTemplate } from "@/features/studies/utils/study-template";

function Harness({ torsionDamping }: { torsionDamping: number }) {
  const initial = studyTemplate("Warning test", 30, 3);
  initial.structure.modes[1].damping = torsionDamping;
  const form = useForm<StudyDocument>({ defaultValues: initial });
  return <StructureFields register={form.register} control={form.control} errors={form.formState.errors} readOnly={false} />;
}

const WARNING = /unusually high for a bridge deck\. Damping is a ratio: 0\.005 is 0\.5 %/;

describe("StructureFields damping warning", () => {
  afterEach(cleanup);

  it("warns when a damping ratio is above 0.05 (the server still accepts it up to 0.2)", () => {
    render(<Harness torsionDamping={0.08} />);
    expect(screen.getByText(WARNING).textContent).toMatch(/^8 % of critical/);
  });

  it("says nothing for a usual deck damping, and warns as soon as one is typed above 0.05", () => {
    render(<Harness torsionDamping={0.004} />);
    expect(screen.queryByText(WARNING)).toBeNull();
    fireEvent.input(screen.getByLabelText("Torsional damping ratio"), { target: { value: "0.15" } });
    expect(screen.getByText(WARNING).textContent).toMatch(/^15 % of critical/);
  });
});
