import { describe, expect, it } from "vitest";
import { SUMMARY_FORMAT, signedSummaryPayloadSchema, summaryPayloadSchema } from "../summary";
import { inventedSummaryV1 } from "./fixtures/invented-summary-v1";
import { inventedSummary } from "./fixtures/invented-summary-v2";

describe("summaryPayloadSchema (stillspan.summary/2)", () => {
  it("accepts a complete summary with its inputs, assessment, changes and sign-off, and keeps every field", () => {
    const summary = inventedSummary();
    expect(SUMMARY_FORMAT).toBe("stillspan.summary/2");
    expect(summaryPayloadSchema.parse(summary)).toEqual(summary);
  });

  it("rejects unknown fields anywhere, so nothing unsigned can ride along", () => {
    const summary = inventedSummary() as Record<string, any>;
    summary.inputs.structure.note = "extra";
    summary.assessment.flutter.extra = 1;
    const issues = summaryPayloadSchema.safeParse(summary).error?.issues ?? [];
    expect(issues.map((i) => i.code)).toEqual(["unrecognized_keys", "unrecognized_keys"]);
  });

  it("rejects a summary without its inputs or its sign-off block, naming them", () => {
    const { inputs: _i, signoff: _s, ...rest } = inventedSummary();
    const paths = summaryPayloadSchema.safeParse(rest).error?.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["inputs", "signoff"]));
  });

  it("reads both formats as signed summaries, by their format tag", () => {
    expect(signedSummaryPayloadSchema.parse(inventedSummaryV1()).format).toBe("stillspan.summary/1");
    expect(signedSummaryPayloadSchema.parse(inventedSummary()).format).toBe("stillspan.summary/2");
    expect(signedSummaryPayloadSchema.safeParse({ ...inventedSummary(), format: "stillspan.summary/3" }).success).toBe(false);
  });
});
