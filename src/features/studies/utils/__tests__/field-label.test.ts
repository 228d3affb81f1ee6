import { describe, expect, it } from "vitest";
import { fieldLabel } from "@/features/studies/utils/format-value";

describe("fieldLabel", () => {
  it("names study fields as an engineer does, with their units", () => {
    expect(fieldLabel("$.structure.modes[1].frequency")).toBe("Mode 2 frequency f (Hz)");
    expect(fieldLabel("$.structure.modes[0].damping")).toBe("Mode 1 damping ratio ζ");
    expect(fieldLabel("$.structure.inertia")).toBe("Inertia I (kg·m²/m)");
    expect(fieldLabel("$.sweep.from")).toBe("Sweep from (m/s)");
    expect(fieldLabel("$.aerodynamics.H3[4]")).toBe("H3* at table row 5");
    expect(fieldLabel("$.aerodynamics.A2")).toBe("A2*");
    expect(fieldLabel("$.aerodynamics.reducedVelocity[0]")).toBe("Ur at table row 1");
  });

  it("falls back to the readable path for fields it does not know", () => {
    expect(fieldLabel("$.something.else[2]")).toBe("something › else 3");
  });
});
