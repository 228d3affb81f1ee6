import { describe, expect, it } from "vitest";
import { canonicalSha256Hex, sha256Hex } from "../hash";

describe("sha256Hex", () => {
  it("matches the FIPS 180-2 Appendix B.1 test vector for 'abc'", () => {
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("matches the SHA-256 of the empty message (FIPS 180-2 / NIST examples)", () => {
    expect(sha256Hex(new Uint8Array())).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
  });
});

describe("canonicalSha256Hex", () => {
  it("hashes the canonical form, so member order does not change the hash", () => {
    expect(canonicalSha256Hex({ b: 2, a: 1 })).toBe(canonicalSha256Hex({ a: 1, b: 2 }));
    expect(canonicalSha256Hex({ a: 1, b: 2 })).toBe(sha256Hex('{"a":1,"b":2}'));
  });

  it("changes when any value changes", () => {
    expect(canonicalSha256Hex({ a: 1, b: 2 })).not.toBe(canonicalSha256Hex({ a: 1, b: 2.0000001 }));
  });
});
