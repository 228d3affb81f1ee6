import { describe, expect, it } from "vitest";
import { SUMMARY_FORMAT_V1, summaryPayloadV1Schema as summaryPayloadSchema } from "../summary-v1";
import { inventedSummaryV1 as inventedSummary } from "./fixtures/invented-summary-v1";

describe("summaryPayloadV1Schema (format 1: summaries signed before format 2 still verify)", () => {
  it("accepts a complete summary and keeps every field", () => {
    const summary = inventedSummary();
    expect(summaryPayloadSchema.parse(summary)).toEqual(summary);
  });

  it("accepts 'not reached' critical speeds as null with a lower-bound margin", () => {
    const summary = { ...inventedSummary(), flutter: null, divergence: null };
    summary.margins = summary.margins.map((m) => ({ ...m, criticalSpeedMps: null, marginIsLowerBound: true }));
    expect(summaryPayloadSchema.safeParse(summary).success).toBe(true);
  });

  it("rejects a phenomenon or a margin status the criteria do not know", () => {
    const summary = inventedSummary();
    summary.margins[0] = { ...summary.margins[0], status: "ok" as never };
    summary.criteria[1] = { ...summary.criteria[1], phenomenon: "buffeting" as never };
    const paths = summaryPayloadSchema.safeParse(summary).error?.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(["criteria.1.phenomenon", "margins.0.status"]);
  });

  it("rejects another format tag", () => {
    const result = summaryPayloadSchema.safeParse({ ...inventedSummary(), format: "stillspan.summary/2" });
    expect(result.success).toBe(false);
    expect(SUMMARY_FORMAT_V1).toBe("stillspan.summary/1");
  });

  it("rejects unknown fields, so nothing unsigned can ride along", () => {
    const result = summaryPayloadSchema.safeParse({ ...inventedSummary(), note: "extra" });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].code).toBe("unrecognized_keys");
  });

  it("rejects a content hash that is not 64 lower-case hex digits, naming the field", () => {
    const summary = inventedSummary();
    summary.revision.contentHash = summary.revision.contentHash.toUpperCase();
    const result = summaryPayloadSchema.safeParse(summary);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].path).toEqual(["revision", "contentHash"]);
  });

  it("rejects a negative speed, a blank statement and a bad signer e-mail", () => {
    const summary = inventedSummary();
    summary.flutter = { ...summary.flutter!, speedMps: -1 };
    summary.statement = "   ";
    summary.signer.email = "not-an-address";
    const paths = summaryPayloadSchema.safeParse(summary).error?.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["flutter.speedMps", "statement", "signer.email"]));
  });

  it("rejects a signing time that is not ISO 8601", () => {
    const result = summaryPayloadSchema.safeParse({ ...inventedSummary(), signedAt: "yesterday" });
    expect(result.error?.issues[0].path).toEqual(["signedAt"]);
  });
});
