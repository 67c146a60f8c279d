import { describe, expect, test } from "vitest";
import {
  type CauerLadder,
  type FosterNetwork,
  InputError,
  cauerToModal,
  fosterToCauer,
  fosterToModal,
  logSpacedTimes,
  modalToFoster,
  zth,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// Continued-fraction synthesis of an RC one-port: Foster, "A reactance theorem", Bell System
// Technical Journal 3 (1924); Cauer, Archiv für Elektrotechnik 17 (1926). Its invariants: the
// ladder's resistances sum to Z(0) = Σ R_i, and its first capacitance is the high-frequency limit
// of the admittance, C_1 = 1/Σ(1/C_i).

describe("fosterToCauer: a 2-stage conversion worked by hand", () => {
  // Foster: R1 = 1 K/W, tau1 = 1 s (C1 = 1 J/K); R2 = 1 K/W, tau2 = 2 s (C2 = 2 J/K).
  //   Z(s) = 1/(1 + s) + 1/(1 + 2s) = (2 + 3s)/(1 + 3s + 2s²),  so Y(s) = (2s² + 3s + 1)/(3s + 2).
  //   C_1 = 2/3 (leading 2 over leading 3);  Y − (2/3)s = ((5/3)s + 1)/(3s + 2).
  //   Z' = (3s + 2)/((5/3)s + 1):  R_1 = 3/(5/3) = 9/5;  Z' − 9/5 = (1/5)/((5/3)s + 1).
  //   Y'' = ((5/3)s + 1)/(1/5) = (25/3)s + 5:  C_2 = 25/3, R_2 = 1/5.
  // Checks: R_1 + R_2 = 2 = R1 + R2; C_1 = 1/(1/1 + 1/2) = 2/3.
  const ladder = fosterToCauer({ kind: "foster", stages: [{ rKPerW: 1, tauS: 1 }, { rKPerW: 1, tauS: 2 }] });
  test.each([
    ["R_1", () => ladder.stages[0]!.rKPerW, 9 / 5],
    ["C_1", () => ladder.stages[0]!.cJPerK, 2 / 3],
    ["R_2", () => ladder.stages[1]!.rKPerW, 1 / 5],
    ["C_2", () => ladder.stages[1]!.cJPerK, 25 / 3],
  ])("%s equals the exact fraction to the last bit", (_, actual, expected) => {
    // Exact rational arithmetic, one rounding at the end: the double nearest the fraction.
    expect(actual()).toBe(expected);
  });
});

/** Invented ladders of 3 to 6 stages spanning microseconds to hours. */
const ladders: [string, CauerLadder][] = [
  ["3 stages", { kind: "cauer", stages: [{ rKPerW: 0.2, cJPerK: 0.01 }, { rKPerW: 0.5, cJPerK: 0.2 }, { rKPerW: 1.5, cJPerK: 3 }] }],
  [
    "4 stages",
    { kind: "cauer", stages: [{ rKPerW: 0.03, cJPerK: 2e-4 }, { rKPerW: 0.1, cJPerK: 5e-3 }, { rKPerW: 0.4, cJPerK: 0.08 }, { rKPerW: 2, cJPerK: 1.2 }] },
  ],
  [
    "5 stages",
    {
      kind: "cauer",
      stages: [{ rKPerW: 0.01, cJPerK: 1e-5 }, { rKPerW: 0.05, cJPerK: 1e-3 }, { rKPerW: 0.3, cJPerK: 0.05 }, { rKPerW: 0.8, cJPerK: 2 }, { rKPerW: 1.2, cJPerK: 60 }],
    },
  ],
  [
    "6 stages",
    {
      kind: "cauer",
      stages: [
        { rKPerW: 0.1, cJPerK: 1e-3 },
        { rKPerW: 0.3, cJPerK: 0.02 },
        { rKPerW: 0.5, cJPerK: 0.3 },
        { rKPerW: 1, cJPerK: 5 },
        { rKPerW: 2, cJPerK: 100 },
        { rKPerW: 0.7, cJPerK: 1000 },
      ],
    },
  ],
];

describe.each(ladders)("Cauer → Foster → Cauer round trip, %s", (_, ladder) => {
  const foster = modalToFoster(cauerToModal(ladder));
  const back = fosterToCauer(foster);

  test("every R and C comes back", () => {
    // Both directions are exact up to rounding (Jacobi eigen to relative accuracy, exact fractions);
    // measured worst 4.9e-14 relative (an R; 3.2e-14 for a C) on these ladders, printed when the
    // tolerance was set, so 2e-13 is about 4x that and still catches any wrong stage.
    expect(back.stages).toHaveLength(ladder.stages.length);
    back.stages.forEach((s, k) => {
      expectClose(s.rKPerW, ladder.stages[k]!.rKPerW, { rel: 2e-13 });
      expectClose(s.cJPerK, ladder.stages[k]!.cJPerK, { rel: 2e-13 });
    });
  });

  test("Foster and Cauer Zth agree at 50 log-spaced times within 1e-12", () => {
    // Both are exact forms of one network, so they agree to rounding: measured worst 1.1e-14
    // relative (1e-14 fails, 1e-13 passes); 1e-12 leaves room for another platform's libm.
    const taus = foster.stages.map((s) => s.tauS);
    const fosterModel = fosterToModal(foster);
    const cauerModel = cauerToModal(back);
    for (const t of logSpacedTimes(Math.min(...taus) / 100, Math.max(...taus) * 100, 50)) expectClose(zth(cauerModel, t), zth(fosterModel, t), { rel: 1e-12 });
  });

  test("ladder resistances sum to the Foster total and C_1 = 1/Σ(1/C_i)", () => {
    // Invariants of the continued-fraction synthesis (see top of file); rounding only: 1e-12.
    const fosterTotal = foster.stages.reduce((a, s) => a + s.rKPerW, 0);
    expectClose(
      back.stages.reduce((a, s) => a + s.rKPerW, 0),
      fosterTotal,
      { rel: 1e-12 },
    );
    const series = 1 / foster.stages.reduce((a, s) => a + s.rKPerW / s.tauS, 0);
    expectClose(back.stages[0]!.cJPerK, series, { rel: 1e-12 });
  });

  test("modalToFoster sorts stages by ascending tau", () => {
    const taus = foster.stages.map((s) => s.tauS);
    expect(taus).toEqual(taus.slice().sort((a, b) => a - b));
  });
});

describe("fosterToCauer on Foster data", () => {
  test("stages with equal tau are one pole and give one Cauer stage", () => {
    const merged = fosterToCauer({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 1 }, { rKPerW: 0.5, tauS: 1 }, { rKPerW: 1, tauS: 10 }] });
    expect(merged.stages).toHaveLength(2);
    // Same network as R = 1 at tau = 1 plus R = 1 at tau = 10: Zth equal (rounding only).
    const single = fosterToModal({ kind: "foster", stages: [{ rKPerW: 1, tauS: 1 }, { rKPerW: 1, tauS: 10 }] });
    for (const t of [0.01, 1, 30]) expectClose(zth(cauerToModal(merged), t), zth(single, t), { rel: 1e-12 });
  });

  test("time constants over eleven decades still convert within the round-trip bound", () => {
    const wide: FosterNetwork = {
      kind: "foster",
      stages: [
        { rKPerW: 0.01, tauS: 1e-6 },
        { rKPerW: 0.1, tauS: 1e-3 },
        { rKPerW: 0.5, tauS: 1 },
        { rKPerW: 2, tauS: 1e5 },
      ],
    };
    const ladder = fosterToCauer(wide);
    const a = fosterToModal(wide);
    const b = cauerToModal(ladder);
    // 1e-6 relative: the library's own round-trip bound.
    for (const t of logSpacedTimes(1e-8, 1e7, 50)) expectClose(zth(b, t), zth(a, t), { rel: 1e-6 });
  });

  test.each([
    [{ kind: "foster", stages: [] } as FosterNetwork, "network.stages: expected at least one Foster stage, found none"],
    [{ kind: "foster", stages: [{ rKPerW: -1, tauS: 1 }] } as FosterNetwork, "network.stages[0].r: expected a thermal resistance > 0 K/W, found -1"],
    [{ kind: "foster", stages: [{ rKPerW: 1, tauS: Number.NaN }] } as FosterNetwork, "network.stages[0].tau: expected a time constant > 0 s, found NaN"],
  ])("bad Foster data is an InputError naming the field", (network, message) => {
    expect(() => fosterToCauer(network)).toThrow(InputError);
    expect(() => fosterToCauer(network)).toThrow(message);
  });
});

describe("modalToFoster", () => {
  test("a model with several sources needs a choice", () => {
    const model = { tauS: [1], sources: ["a", "b"], observed: ["a"], gainKPerW: [[[1], [0.5]]] };
    expect(() => modalToFoster(model)).toThrow("network.sources: expected a model with exactly one entry, or a name to pick, found [\"a\",\"b\"]");
    expect(modalToFoster(model, "a", "b").stages).toEqual([{ rKPerW: 0.5, tauS: 1 }]);
  });

  test("a negative gain (a transfer impedance) is not a Foster network", () => {
    const model = { tauS: [1, 2], sources: ["a"], observed: ["b"], gainKPerW: [[[1, -0.5]]] };
    expect(() => modalToFoster(model)).toThrow("network.gainKPerW[0][0][1]: expected a positive gain (a Foster network has R > 0), found -0.5");
  });
});
