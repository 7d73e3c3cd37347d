import { describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { contentHash } from "../../../server/commands/signatureRecorder.js";

describe("what a signature is bound to", () => {
  it("hashes the RFC 8785 canonical form of the content", () => {
    // RFC 8785 (JSON Canonicalization Scheme) §3.2.3 example, from memory: sorted keys,
    // ECMAScript number form, minimal string escapes.
    const input = { numbers: [333333333.33333329, 1e30, 4.5, 2e-3, 0.000000000000000000000000001], string: "\u20ac$\u000F\u000aA'\u0042\u0022\u005c\\\"/", literals: [null, true, false] };
    const canonical = '{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],"string":"€$\\u000f\\nA\'B\\"\\\\\\\\\\"/"}';
    expect(contentHash(input)).toBe(createHash("sha256").update(canonical, "utf8").digest("hex"));
  });

  it("does not depend on key order but does on every value", () => {
    expect(contentHash({ a: 1, b: { c: 2, d: [1, 2] } })).toBe(contentHash({ b: { d: [1, 2], c: 2 }, a: 1 }));
    expect(contentHash({ a: 1, b: { c: 2, d: [1, 2] } })).not.toBe(contentHash({ a: 1, b: { c: 2, d: [2, 1] } }));
  });
});
