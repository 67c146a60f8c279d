import { describe, expect, test } from "vitest";
import { cauerToModal, loadProfile, logSpacedTimes, sizeScaledProfile, sizeShortTimeCapacity, zth } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// Identity checks behind the sizing: scaling every capacity at fixed resistances is scaling every
// time constant (Z_k(t) = Z(t/k), the time-scaling property of the Laplace transform: Oppenheim &
// Willsky, Signals and Systems, 2nd ed. (1997), §9.5.6, section from memory), and the first
// capacity is C1.
const ladder = { kind: "cauer" as const, stages: [{ cJPerK: 0.02, rKPerW: 0.3 }, { cJPerK: 0.9, rKPerW: 1.1 }, { cJPerK: 40, rKPerW: 2.5 }] };

describe("sizing identities", () => {
  test.each([0.01, 0.37, 1, 4.2, 1000])("a Cauer ladder with every C × %f has the Zth of the modal form with every tau × k", (k) => {
    const scaledByHand = cauerToModal({ kind: "cauer", stages: ladder.stages.map((s) => ({ cJPerK: s.cJPerK * k, rKPerW: s.rKPerW })) });
    const text = `name: t
ambient: 25 degC
parts:
  - id: p
    network: { form: cauer, stages: [ ${ladder.stages.map((s) => `{ r: ${s.rKPerW} K/W, c: ${s.cJPerK} J/K }`).join(", ")} ] }
    limits: { maxTemperature: 150 degC }
events:
  - wait: 1 s
`;
    const scaled = sizeScaledProfile(loadProfile(text, "t.yaml"), 0, k).parts[0]!.model;
    // both come from the same symmetric eigen-solver on matrices that differ by the factor k, so they
    // agree to rounding: measured 3.0e-15 relative at worst over these k (printed when the tolerance
    // was set); 1.5e-14 is 5x that
    for (const t of logSpacedTimes(1e-4 * k, 1e3 * k, 30)) expectClose(zth(scaled, t), zth(scaledByHand, t), { rel: 1.5e-14 });
  });

  test("the first capacity of a Cauer ladder heated and observed at its first node is C1 (initial slope of Zth is 1/C1)", () => {
    // Incropera et al., 7th ed. (2011), §5.1 and §5.3: at t → 0 no heat has left the first lump,
    // dT/dt = P/C1
    expectClose(sizeShortTimeCapacity(cauerToModal(ladder), 0, 0), 0.02, { rel: 1e-9 });
  });

  test("a network with no mode from source to node never heats: infinite first capacity", () => {
    expect(sizeShortTimeCapacity({ tauS: [1], sources: ["a"], observed: ["a"], gainKPerW: [[[0]]] }, 0, 0)).toBe(Infinity);
  });
});
