import { describe, expect, it } from "vitest";
import { verificationCodeOf } from "../../../shared/verification-code.js";
import { verificationCode } from "../verification-code.js";

describe("verification code", () => {
  it("is the first 12 hex digits of SHA-256 over the JWS, grouped by four", () => {
    // SHA-256("abc") = ba7816bf8f01cfea… (FIPS 180-2, Appendix B.1)
    expect(verificationCode("abc")).toBe("ba78-16bf-8f01");
  });

  it("is the same in the browser (Web Crypto) and on the server (node:crypto)", async () => {
    for (const text of ["abc", "eyJhbGciOiJFZERTQSJ9.e30.c2ln", "ζ λ ±"]) {
      expect(await verificationCodeOf(text)).toBe(verificationCode(text));
    }
  });
});
