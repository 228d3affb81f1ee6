import { describe, expect, it } from "vitest";
import { CanonicalJsonError, canonicalJson, canonicalJsonBytes } from "@shared/canonical-json";

// Check values from RFC 8785 "JSON Canonicalization Scheme (JCS)", June 2020:
// §3.2.2/§3.2.3 (the sample object), §3.2.3 (sorting example), §3.2.4 (UTF-8 bytes), Appendix B (numbers).
describe("canonicalJson (RFC 8785)", () => {
  it("writes the RFC 8785 §3.2.2 sample object as published in §3.2.3", () => {
    const input = JSON.parse(String.raw`{
      "numbers": [333333333.33333329, 1E30, 4.50, 2e-3, 0.000000000000000000000000001],
      "string": "\u20ac$\u000F\u000aA'\u0042\u0022\u005c\\\"\/",
      "literals": [null, true, false]
    }`);
    const expected = String.raw`{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],"string":"€$\u000f\nA'B\"\\\\\"/"}`;
    expect(canonicalJson(input)).toBe(expected);
  });

  it("produces the UTF-8 bytes of RFC 8785 §3.2.4 for the sample's first bytes and the euro sign", () => {
    const bytes = canonicalJsonBytes({ literals: [null, true, false], string: "€" });
    // §3.2.4 starts 7b 22 6c 69 74 65 72 61 6c 73 22 3a 5b 6e 75 6c 6c ('{"literals":[null'); € is e2 82 ac.
    expect(Array.from(bytes.slice(0, 17))).toEqual([
      0x7b, 0x22, 0x6c, 0x69, 0x74, 0x65, 0x72, 0x61, 0x6c, 0x73, 0x22, 0x3a, 0x5b, 0x6e, 0x75, 0x6c, 0x6c,
    ]);
    expect(Array.from(canonicalJsonBytes("€"))).toEqual([0x22, 0xe2, 0x82, 0xac, 0x22]);
  });

  it("sorts properties by UTF-16 code units as in the RFC 8785 §3.2.3 sorting example", () => {
    const input = JSON.parse(String.raw`{
      "\u20ac": "Euro Sign",
      "\r": "Carriage Return",
      "\ufb33": "Hebrew Letter Dalet With Dagesh",
      "1": "One",
      "\ud83d\ude00": "Emoji: Grinning Face",
      "\u0080": "Control",
      "\u00f6": "Latin Small Letter O With Diaeresis"
    }`);
    const expected =
      '{"\\r":"Carriage Return","1":"One","\u0080":"Control","\u00f6":"Latin Small Letter O With Diaeresis",' +
      '"\u20ac":"Euro Sign","\ud83d\ude00":"Emoji: Grinning Face","\ufb33":"Hebrew Letter Dalet With Dagesh"}';
    expect(canonicalJson(input)).toBe(expected);
  });

  // RFC 8785 Appendix B: IEEE 754 bit patterns and their canonical number text.
  const appendixB: [string, string][] = [
    ["0000000000000000", "0"],
    ["8000000000000000", "0"],
    ["0000000000000001", "5e-324"],
    ["8000000000000001", "-5e-324"],
    ["7fefffffffffffff", "1.7976931348623157e+308"],
    ["ffefffffffffffff", "-1.7976931348623157e+308"],
    ["4340000000000000", "9007199254740992"],
    ["c340000000000000", "-9007199254740992"],
    ["4430000000000000", "295147905179352830000"],
    ["44b52d02c7e14af5", "9.999999999999997e+22"],
    ["44b52d02c7e14af6", "1e+23"],
    ["44b52d02c7e14af7", "1.0000000000000001e+23"],
    ["444b1ae4d6e2ef4e", "999999999999999700000"],
    ["444b1ae4d6e2ef4f", "999999999999999900000"],
    ["444b1ae4d6e2ef50", "1e+21"],
    ["3eb0c6f7a0b5ed8c", "9.999999999999997e-7"],
    ["3eb0c6f7a0b5ed8d", "0.000001"],
    ["41b3de4355555553", "333333333.3333332"],
    ["41b3de4355555554", "333333333.33333325"],
    ["41b3de4355555555", "333333333.3333333"],
    ["41b3de4355555556", "333333333.3333334"],
    ["41b3de4355555557", "333333333.33333343"],
    ["becbf647612f3696", "-0.0000033333333333333333"],
    ["43143ff3c1cb0959", "1424953923781206.2"],
  ];
  it.each(appendixB)("writes the IEEE 754 value %s as %s (RFC 8785 Appendix B)", (hex, expected) => {
    const view = new DataView(new ArrayBuffer(8));
    view.setBigUint64(0, BigInt(`0x${hex}`));
    expect(canonicalJson(view.getFloat64(0))).toBe(expected);
  });

  it("refuses NaN and Infinity, the Appendix B error rows, naming the JSON path", () => {
    expect(() => canonicalJson({ a: [1, Number.NaN] })).toThrow(/NaN is not a JSON number at \$\.a\[1\]/);
    expect(() => canonicalJson({ b: { c: Number.POSITIVE_INFINITY } })).toThrow(/at \$\.b\.c/);
  });

  it("refuses values that have no JSON form instead of writing null", () => {
    expect(() => canonicalJson(undefined)).toThrow(CanonicalJsonError);
    expect(() => canonicalJson([1, undefined])).toThrow(/at \$\[1\]/);
    expect(() => canonicalJson({ n: 10n })).toThrow(/bigint/);
    const loop: Record<string, unknown> = {};
    loop.self = loop;
    expect(() => canonicalJson(loop)).toThrow(/circular/);
  });

  it("refuses a lone surrogate (not I-JSON)", () => {
    expect(() => canonicalJson({ s: "\ud800" })).toThrow(/surrogate/i);
  });

  it("gives the same text whatever the member order of the input", () => {
    expect(canonicalJson({ b: 1, a: { d: [3, 2], c: null } })).toBe(canonicalJson({ a: { c: null, d: [3, 2] }, b: 1 }));
    expect(canonicalJson({ b: 1, a: 2 })).toBe('{"a":2,"b":1}');
  });
});
