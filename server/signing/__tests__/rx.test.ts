import { expect, it } from "vitest";
it("x", () => { expect({ a: "hello" }).toMatchObject({ a: /zzz/ }); });
