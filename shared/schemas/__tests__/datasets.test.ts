import { describe, expect, it } from "vitest";
import { datasetMetaSchema, patchDatasetSchema } from "@shared/schemas/datasets";

const meta = (meanAngleDeg: unknown) => ({
  kind: "flutter-derivatives",
  name: "Section model",
  meanAngleDeg,
  convention: { abscissa: "Ur", normalisation: "B", sign: "h-down" },
  provenance: { flow: "smooth" },
});

describe("mean angle of attack of a data set", () => {
  it("takes the usual test angles (0°, ±3°, ±5°) and defaults to 0°", () => {
    expect(datasetMetaSchema.parse(meta(-3)).meanAngleDeg).toBe(-3);
    const { meanAngleDeg: _omitted, ...withoutAngle } = meta(0);
    expect(datasetMetaSchema.parse(withoutAngle).meanAngleDeg).toBe(0);
  });

  it("refuses an angle beyond ±90° on upload and on rename, with the field named", () => {
    const upload = datasetMetaSchema.safeParse(meta(1e300));
    expect(upload.success).toBe(false);
    expect(upload.error?.issues[0]).toMatchObject({ path: ["meanAngleDeg"], message: "must be at most 90°" });
    const patch = patchDatasetSchema.safeParse({ meanAngleDeg: -120 });
    expect(patch.error?.issues[0]).toMatchObject({ path: ["meanAngleDeg"], message: "must be at least -90°" });
  });
});
