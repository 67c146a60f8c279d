import { describe, expect, test } from "vitest";
import { InputError, adiabaticMass, cauerToGraph, cauerToModal, constantPowerSegment, lumpedNetwork, materialPreset, runThermalHistory, traceSteps, zth } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

describe("lumpedNetwork", () => {
  test("one lump: C = m·c, tau = R·C, Zth = R·(1 − e^(−t/tau))", () => {
    // 3 g of nichrome (c = 420 J/(kg K), Incropera 7th ed. Table A.1, from memory) to ambient
    // through 40 K/W: C = 0.003·420 = 1.26 J/K, tau = 50.4 s.
    // Source: Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.1, eq. 5.6-5.7.
    const ladder = lumpedNetwork({ element: { massKg: 0.003, specificHeatJPerKgK: materialPreset("nichrome").specificHeatJPerKgK }, rToAmbientKPerW: 40 });
    expect(ladder).toEqual({ kind: "cauer", part: "resistor", stages: [{ cJPerK: 0.003 * 420, rKPerW: 40 }] });
    const model = cauerToModal(ladder);
    // eigen-decomposition of a 1×1 system: rounding only, 1e-13
    expectClose(model.tauS[0]!, 50.4, { rel: 1e-13 });
    for (const t of [0.1, 10, 50.4, 300]) expectClose(zth(model, t), 40 * -Math.expm1(-t / 50.4), { rel: 1e-13 });
  });

  test("two lumps: steady Zth is R1 + R2 and the early slope is 1/C_element", () => {
    // Element 0.5 g of nichrome (C1 = 0.21 J/K) on a 20 g alumina core (C2 = 0.02·765 = 15.3 J/K),
    // 2 K/W between them and 25 K/W to ambient. Series resistances add at steady state, and for
    // t ≪ every tau the element heats adiabatically, Zth(t) ≈ t/C1 (Incropera 7th ed. §5.1 and §5.3).
    const ladder = lumpedNetwork({
      element: { massKg: 0.0005, specificHeatJPerKgK: 420 },
      body: { massKg: 0.02, specificHeatJPerKgK: 765, rElementToBodyKPerW: 2 },
      rToAmbientKPerW: 25,
    });
    const model = cauerToModal(ladder);
    expect(model.tauS.length).toBe(2);
    // the lumps are the ladder's nodes, named as the lumps are (a resistor's element and body)
    expect(cauerToGraph(ladder).nodes.map((n) => n.id)).toEqual(["element", "body"]);
    // Σ gains: eigen-decomposition rounding, 1e-12
    expectClose(model.gainKPerW[0]![0]!.reduce((a, b) => a + b, 0), 27, { rel: 1e-12 });
    // t = 1e-6 s against the fastest tau ≈ 0.41 s: the first-order gap is t/(2·tau) ≈ 1.2e-6, so 1e-5
    expectClose(zth(model, 1e-6), 1e-6 / 0.21, { rel: 1e-5 });
  });

  test("lumpedNetwork names the bad field", () => {
    expect(() => lumpedNetwork({ element: { massKg: 0, specificHeatJPerKgK: 420 }, rToAmbientKPerW: 10 })).toThrow(
      new InputError({ code: "out-of-range", file: "", line: 0, field: "lumped.element.mass", expected: "a mass > 0 kg", found: "0" }),
    );
  });
});

describe("adiabaticMass", () => {
  // m = E / (c·ΔT). Source: Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed.
  // (2011), §1.3.1, stored thermal energy ΔE_st = m·c·ΔT.
  // Worked examples (computed by hand):
  //   12 J into copper (c = 385), ΔT = 150 K: m = 12 / (385·150) = 12 / 57 750 = 2.077 922e-4 kg (0.208 g)
  //   50 J into nichrome (c = 420), ΔT = 300 K: m = 50 / 126 000 = 3.968 254e-4 kg (0.397 g)
  //   400 J into alumina (c = 765), ΔT = 200 K: m = 400 / 153 000 = 2.614 379e-3 kg (2.61 g)
  // 1e-6 relative: the hand values carry 7 significant digits.
  test.each([
    [12, "copper", 150, 2.077922e-4],
    [50, "nichrome", 300, 3.968254e-4],
    [400, "alumina", 200, 2.614379e-3],
  ] as const)("adiabaticMass(%d J, %s, %d K) = %s kg", (energy, material, rise, mass) => {
    expectClose(adiabaticMass(energy, materialPreset(material).specificHeatJPerKgK, rise), mass, { rel: 1e-6 });
  });

  test("a lump of exactly the adiabatic mass, heated by a short pulse, rises by the allowed ΔT", () => {
    // identity with the exact engine: a 1 ms pulse of 12 J into the copper lump of the worked
    // example, with 50 K/W to ambient (tau = 50·0.08 = 4 s): heat lost during the pulse is about
    // t_p/(2·tau) = 1.25e-4 of the energy, so the rise is 150 K within 2e-4.
    const m = adiabaticMass(12, 385, 150);
    const model = cauerToModal(lumpedNetwork({ element: { massKg: m, specificHeatJPerKgK: 385 }, rToAmbientKPerW: 50 }));
    const run = runThermalHistory(model, traceSteps([[constantPowerSegment(0, 1e-3, 12 / 1e-3)]], 0, 2e-3));
    expectClose(run.peakRiseK[0]!, 150, { rel: 2e-4 });
    expect(run.peakRiseK[0]!).toBeLessThan(150);
  });

  test("adiabaticMass rejects a zero rise", () => {
    expect(() => adiabaticMass(12, 385, 0)).toThrow("rise: expected an allowed temperature rise > 0 K, found 0");
  });
});
