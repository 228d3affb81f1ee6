import { describe, expect, it } from "vitest";
import {
  screeningOptionsResolver,
  toOptionsValues,
  toScreeningOptions,
} from "@/features/criteria/utils/screening-options-values";

const resolve = (values: ReturnType<typeof toOptionsValues>) =>
  screeningOptionsResolver(values, undefined, { fields: {}, shouldUseNativeValidation: false });

describe("screening options as typed", () => {
  it("empty inputs mean 'not given'", async () => {
    expect(toScreeningOptions(toOptionsValues())).toEqual({});
    const result = await resolve(toOptionsValues());
    expect(result.errors).toEqual({});
    expect(result.values).toEqual({});
  });

  it("a measured St needs its source; with it, both go to the request", async () => {
    const values = { ...toOptionsValues(), strouhalNumber: "0.11" };
    expect((await resolve(values)).errors.strouhalBasis?.message).toBe(
      "say where the Strouhal number comes from (test report, reference)",
    );
    const withSource = await resolve({ ...values, strouhalBasis: "Section-model test report R-12" });
    expect(withSource.errors).toEqual({});
    expect(withSource.values).toEqual({ strouhalNumber: 0.11, strouhalBasis: "Section-model test report R-12" });
  });

  it("lift slope without drag is refused at the missing one (the shared schema's rule)", async () => {
    const { errors } = await resolve({ ...toOptionsValues(), liftSlope: "-3" });
    expect(errors.dragCoefficient?.message).toBe("is required with the other static coefficient");
  });

  it("text that is not a number is named at its field", async () => {
    const { errors } = await resolve({ ...toOptionsValues(), dragCoefficient: "1,2" });
    expect(errors.dragCoefficient?.message).toBe("must be a number");
  });
});
