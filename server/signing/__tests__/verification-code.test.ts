import { describe, expect, it } from "vitest";
import { verificationCode } from "../verification-code.js";

describe("verification code", () => {
  it("is the first 12 hex digits of SHA-256 over the JWS, grouped by four", () => {
    // SHA-256("abc") = ba7816bf8f01cfea… (FIPS 180-2, Appendix B.1)
    expect(verificationCode("abc")).toBe("ba78-16bf-8f01");
  });
});
