import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { type BusLoad, type ChargeConditions, type CircuitResult, chargeSeriesResistor, segmentEnergy, validatePowerTrace } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { sumParts, traceAt } from "./circuitResultProbes.js";
import { inputErrorMessage } from "./inputErrorMessage.js";

const traceEnergy = (r: CircuitResult, role: string): number =>
  (r.traces[role] ?? []).reduce((e, s) => e + segmentEnergy(s.terms, s.durationS), 0);
const conditions = (over: Partial<ChargeConditions> & { completion?: ChargeConditions["completion"] } = {}): ChargeConditions => ({
  sourceVoltageV: 400,
  initialVoltageV: 0,
  completion: { fraction: 0.95, timeoutS: 5 },
  ...over,
});

describe("chargeSeriesResistor: no load", () => {
  // Charging C through R from V0 to Vs: i = C·dV/dt and i·R = Vs − V, so the resistor takes
  // ∫i²R dt = ∫(Vs − V)·C dV = C·(Vs − V0)²/2, independent of R (integrated here). Source of the
  // response and the relations: Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed.
  // (2012), §8.8 driven RC circuit and §7.1 capacitor (section numbers from memory). A dwell of
  // 60·τ leaves Vs − V = (Vs − V0)·e^−60,
  // below 1e-26 relative, so the full-charge energy applies to 1e-9.
  test("resistor energy is C·(Vs − V0)²/2 for any R (property, 1e-9 relative)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 1e4, noNaN: true }),
        fc.double({ min: 1e-6, max: 0.1, noNaN: true }),
        fc.double({ min: 1, max: 1000, noNaN: true }),
        fc.double({ min: 0, max: 0.99, noNaN: true }),
        (rOhm, cF, vs, v0Fraction) => {
          const v0 = v0Fraction * vs;
          const tau = rOhm * cF;
          const r = chargeSeriesResistor({ resistanceOhm: rOhm, capacitanceF: cF }, conditions({ sourceVoltageV: vs, initialVoltageV: v0, completion: { dwellS: 60 * tau, timeoutS: 61 * tau } }));
          const expected = (cF * (vs - v0) ** 2) / 2;
          expectClose(r.energy.partsJ.resistor!, expected, { rel: 1e-9 });
          // the trace is exact, so its integral is the same energy (rounding only)
          expectClose(traceEnergy(r, "resistor"), expected, { rel: 1e-9 });
          expect(r.outcome).toBe("completed");
        },
      ),
      { numRuns: 200, seed: 20261202 },
    );
  });

  // V(t) = Vs·(1 − e^(−t/τ)) reaches 0.95·Vs at t = τ·ln 20 ≈ 2.996·τ. Source: Hayt, Kemmerly &
  // Durbin, 8th ed. (2012), §8.2, properties of the exponential response (section from memory:
  // "the response is within 5 % of its final value after 3 τ").
  test.each([
    [100, 1e-3],
    [4.7, 2.2e-3],
    [1e3, 10e-6],
  ])("R = %d Ω, C = %d F from 0 V: 95 %% at τ·ln 20 (1e-12 relative)", (rOhm, cF) => {
    const r = chargeSeriesResistor({ resistanceOhm: rOhm, capacitanceF: cF }, conditions());
    expect(r.outcome).toBe("completed");
    // closed form in double precision: only rounding of the logarithm
    expectClose(r.durationS, rOhm * cF * Math.log(20), { rel: 1e-12 });
    expectClose(r.endVoltageV, 380, { rel: 1e-15 });
    expect(r.reason).toBe(`bus reached 95 % of 400 V (380 V) at ${Number((rOhm * cF * Math.log(20)).toPrecision(4))} s`);
  });

  test("resistor power trace equals (Vs − V(t))²/R with V(t) = Vs + (V0 − Vs)·e^(−t/τ) at every time", () => {
    const rOhm = 22;
    const cF = 4.7e-3;
    const tau = rOhm * cF;
    const v0 = 120;
    const r = chargeSeriesResistor({ resistanceOhm: rOhm, capacitanceF: cF }, conditions({ initialVoltageV: v0 }));
    for (const t of [0, 0.1 * tau, tau, 2 * tau, 0.999 * r.durationS]) {
      const v = 400 + (v0 - 400) * Math.exp(-t / tau);
      // exact terms against the same closed form: rounding only
      expectClose(traceAt(r, "resistor", t), (400 - v) ** 2 / rOhm, { rel: 1e-12 });
    }
  });

  test("a source resistance shares the loss in proportion R : Rsrc and slows the charge to (R + Rsrc)·C", () => {
    const r = chargeSeriesResistor({ resistanceOhm: 30, sourceResistanceOhm: 10, capacitanceF: 1e-3 }, conditions());
    // series resistors carry the same current: energies in the ratio of the resistances (Ohm's law)
    expectClose(r.energy.partsJ.resistor! / r.energy.partsJ.sourceResistance!, 3, { rel: 1e-12 });
    expectClose(r.durationS, 40 * 1e-3 * Math.log(20), { rel: 1e-12 });
    expect(Object.keys(r.traces)).toEqual(["resistor"]);
  });

  test("a capacitor already above the threshold completes at once with no power", () => {
    const r = chargeSeriesResistor({ resistanceOhm: 10, capacitanceF: 1e-3 }, conditions({ initialVoltageV: 390 }));
    expect(r.outcome).toBe("completed");
    expect(r.durationS).toBe(0);
    expect(r.traces.resistor).toEqual([]);
  });

  test("withinV: completes at Vs − withinV; both rules given: the first reached", () => {
    const rc = 10 * 1e-3;
    const within = chargeSeriesResistor({ resistanceOhm: 10, capacitanceF: 1e-3 }, conditions({ completion: { withinV: 4, timeoutS: 1 } }));
    // Vs·e^(−t/τ) = 4 V → t = τ·ln(100)
    expectClose(within.durationS, rc * Math.log(100), { rel: 1e-12 });
    const both = chargeSeriesResistor({ resistanceOhm: 10, capacitanceF: 1e-3 }, conditions({ completion: { withinV: 4, fraction: 0.9, timeoutS: 1 } }));
    expectClose(both.durationS, rc * Math.log(10), { rel: 1e-12 });
  });

  test("timeout before the threshold: timed-out, the bus not stalled (still rising toward it)", () => {
    const r = chargeSeriesResistor({ resistanceOhm: 100, capacitanceF: 1e-3 }, conditions({ completion: { fraction: 0.95, timeoutS: 0.1 } }));
    expect(r.outcome).toBe("timed-out");
    expect(r.busStalled).toBe(false);
    expect(r.durationS).toBe(0.1);
    expectClose(r.endVoltageV, 400 * -Math.expm1(-1), { rel: 1e-14 });
    expect(r.reason).toBe("timeout at 0.1 s with the bus at 252.8 V, still short of 95 % of 400 V (380 V)");
  });
});

describe("chargeSeriesResistor: loads on the bus", () => {
  // Thévenin: the bus sees Vs·RL/(R + RL) behind R ∥ RL, so Vc → Vs·RL/(R + RL) with
  // τ' = C·R·RL/(R + RL). Source: Hayt, Kemmerly & Durbin, 8th ed. (2012), §5.3 (Thévenin
  // equivalent) and §8.8 (driven RC circuit) (section numbers from memory).
  test.each([
    // RL, expected outcome (threshold 95 % of 400 V = 380 V): completed, or the timer ends the
    // attempt with the bus stalled at the divider voltage below the threshold
    [10_000, "completed"],
    [1_000, "timed-out"],
  ])("resistive load %d Ω: divider voltage Vs·RL/(R + RL); %s", (rl, outcome) => {
    const r = chargeSeriesResistor({ resistanceOhm: 100, capacitanceF: 1e-3, load: { kind: "resistive", resistanceOhm: rl } }, conditions());
    const vf = (400 * rl) / (100 + rl);
    const tauP = (1e-3 * 100 * rl) / (100 + rl);
    expect(r.outcome).toBe(outcome);
    expect(r.busStalled).toBe(outcome === "timed-out");
    if (outcome === "completed") expectClose(r.durationS, tauP * Math.log(vf / (vf - 380)), { rel: 1e-12 });
    else {
      expect(r.reason).toBe(`bus settles at ${Number(vf.toPrecision(4))} V, below 95 % of 400 V (380 V); timeout at 5 s with the bus at ${Number(vf.toPrecision(4))} V`);
      // after 5 s = 55·τ' the bus sits at the divider voltage to rounding
      expectClose(r.endVoltageV, vf, { rel: 1e-12 });
    }
  });

  test("shorted bus: full voltage across the resistor until the timeout; a charged capacitor dumps into the short", () => {
    const r = chargeSeriesResistor({ resistanceOhm: 50, sourceResistanceOhm: 0.5, capacitanceF: 1e-3, load: { kind: "short" } }, conditions({ initialVoltageV: 100, completion: { fraction: 0.9, timeoutS: 0.25 } }));
    expect(r.outcome).toBe("timed-out");
    expect(r.busStalled).toBe(true);
    expect(r.durationS).toBe(0.25);
    expect(r.endVoltageV).toBe(0);
    const i = 400 / 50.5;
    // Ohm's law, exact
    expectClose(traceAt(r, "resistor", 0.1), i * i * 50, { rel: 1e-14 });
    expectClose(r.energy.partsJ.resistor!, i * i * 50 * 0.25, { rel: 1e-14 });
    expectClose(r.energy.loadJ, 0.5 * 1e-3 * 100 * 100, { rel: 1e-14 });
    expect(r.reason).toBe("bus held at 0 V (shorted), below 90 % of 400 V (380 V)".replace("380", "360") + "; timeout at 0.25 s");
  });

  test("a short with a fixed dwell completes at the dwell (the controller does not look at the voltage)", () => {
    const r = chargeSeriesResistor({ resistanceOhm: 50, capacitanceF: 1e-3, load: { kind: "short" } }, conditions({ completion: { dwellS: 0.2, timeoutS: 1 } }));
    expect(r.outcome).toBe("completed");
    expect(r.durationS).toBe(0.2);
    expect(r.reason).toBe("fixed dwell of 0.2 s ended with the bus at 0 V");
  });

  // Constant-current load I: C·dV/dt = (Vs − V)/R − I, final value Vs − I·R (driven RC circuit,
  // Hayt, Kemmerly & Durbin, 8th ed. (2012), §8.8, section from memory). Below 0 V a real load
  // cannot draw: the bus is held at 0 V.
  test.each([
    [1, 300, "timed-out"],
    [0.1, 390, "completed"],
  ])("constant-current load %d A settles toward Vs − I·R = %d V: %s", (ia, vf, outcome) => {
    const r = chargeSeriesResistor({ resistanceOhm: 100, capacitanceF: 1e-3, load: { kind: "constant-current", currentA: ia } }, conditions());
    expect(r.outcome).toBe(outcome);
    expect(r.busStalled).toBe(outcome === "timed-out");
    if (outcome === "completed") expectClose(r.durationS, 0.1 * Math.log(vf / (vf - 380)), { rel: 1e-12 });
    else expectClose(r.endVoltageV, vf, { rel: 1e-12 });
  });

  test("constant-current load larger than Vs/R: bus held at 0 V, resistor takes Vs²/R", () => {
    const r = chargeSeriesResistor({ resistanceOhm: 100, capacitanceF: 1e-3, load: { kind: "constant-current", currentA: 5 } }, conditions({ completion: { fraction: 0.95, timeoutS: 2 } }));
    expect(r.outcome).toBe("timed-out");
    expect(r.busStalled).toBe(true);
    expect(r.endVoltageV).toBe(0);
    expectClose(r.energy.partsJ.resistor!, (400 * 400) / 100 * 2, { rel: 1e-14 });
    expect(r.reason).toBe("bus held at 0 V (the load takes more than the source can give), below 95 % of 400 V (380 V); timeout at 2 s");
  });

  test("constant-current load with an enable voltage switches on at it: a kink in the current, not in the voltage", () => {
    const load: BusLoad = { kind: "constant-current", currentA: 0.5, enableV: 200, disableV: 100 };
    const r = chargeSeriesResistor({ resistanceOhm: 100, capacitanceF: 1e-3, load }, conditions({ wantSamples: true }));
    // before 200 V: plain charge, reaching 200 V at τ·ln 2; then toward 350 V, stalling below 380 V
    expect(r.outcome).toBe("timed-out");
    expect(r.busStalled).toBe(true);
    expectClose(r.endVoltageV, 350, { rel: 1e-9 });
    const tOn = 0.1 * Math.log(2);
    const seg = r.traces.resistor!;
    expect(seg.length).toBe(2);
    expectClose(seg[1]!.startS, tOn, { rel: 1e-14 });
  });
});

describe("chargeSeriesResistor: energy balance", () => {
  const loadArb: fc.Arbitrary<BusLoad> = fc.oneof(
    fc.constant<BusLoad>({ kind: "none" }),
    fc.constant<BusLoad>({ kind: "short" }),
    fc.double({ min: 10, max: 1e5, noNaN: true }).map((r): BusLoad => ({ kind: "resistive", resistanceOhm: r })),
    fc.tuple(fc.double({ min: 0.01, max: 10, noNaN: true }), fc.oneof(fc.constant(0), fc.double({ min: 10, max: 300, noNaN: true })), fc.double({ min: 0, max: 0.9, noNaN: true })).map(
      ([i, en, dis]): BusLoad => ({ kind: "constant-current", currentA: i, enableV: en, disableV: en * dis }),
    ),
    fc.tuple(fc.double({ min: 1, max: 800, noNaN: true }), fc.double({ min: 50, max: 380, noNaN: true }), fc.double({ min: 0.3, max: 0.95, noNaN: true })).map(
      ([p, en, dis]): BusLoad => ({ kind: "constant-power", powerW: p, enableV: en, disableV: en * dis }),
    ),
  );
  // Arbitraries are bounded so that every run costs about the same: timeouts up to 20 τ, lockout
  // hysteresis at least 5 % of the enable voltage (a few thousand load cycles at most), and a fixed
  // seed, so CI is deterministic in cost and outcome.
  // Conservation of energy (Tellegen's theorem, Desoer & Kuh, Basic Circuit Theory (1969), §9.5,
  // from memory): source = ΔE_C + Σ parts + load. Linear regimes are exact integrals (rounding);
  // constant-power regimes carry ∫V dt and ∫V² dt in the ODE at tolerance 1e-11 per stretch.
  // Measured over these 150 runs when the tolerances were set, as a fraction of the energies'
  // scale: 6.6e-16 in linear regimes, 1.3e-12 with a constant-power load; the bounds are about 6x
  // and 4x those.
  test("source = stored + parts + load for every load (property)", () => {
    fc.assert(
      fc.property(
        loadArb,
        fc.double({ min: 1, max: 1000, noNaN: true }),
        fc.oneof(fc.constant(0), fc.double({ min: 0.01, max: 50, noNaN: true })),
        fc.double({ min: 1e-5, max: 1e-2, noNaN: true }),
        fc.double({ min: 0, max: 1.1, noNaN: true }),
        fc.double({ min: 0.1, max: 20, noNaN: true }),
        (load, rOhm, rSrc, cF, v0Frac, timeoutTau) => {
          const tau = (rOhm + rSrc) * cF;
          const r = chargeSeriesResistor({ resistanceOhm: rOhm, sourceResistanceOhm: rSrc, capacitanceF: cF, load }, conditions({ initialVoltageV: 400 * v0Frac, completion: { fraction: 0.95, timeoutS: timeoutTau * tau } }));
          const e = r.energy;
          const scale = Math.abs(e.sourceJ) + Math.abs(e.storedJ) + Math.abs(e.loadJ) + sumParts(r);
          expectClose(e.sourceJ, e.storedJ + sumParts(r) + e.loadJ, { abs: (load.kind === "constant-power" ? 5e-12 : 4e-15) * scale });
          expect(Number.isFinite(r.endVoltageV)).toBe(true);
          // the trace is a valid engine input: ordered, not overlapping, finite terms
          validatePowerTrace(r.traces.resistor!, "resistor");
          const last = r.traces.resistor!.at(-1);
          if (last !== undefined) expect(last.startS + last.durationS).toBeLessThanOrEqual(r.durationS * (1 + 1e-12));
        },
      ),
      { numRuns: 150, seed: 20261202 },
    );
  });
});

describe("chargeSeriesResistor: bad input", () => {
  const ok = { resistanceOhm: 10, capacitanceF: 1e-3 };
  test.each([
    [{ ...ok, capacitanceF: 0 }, conditions(), "capacitanceF: expected a capacitance > 0 F, found 0"],
    [{ ...ok, capacitanceF: -1e-3 }, conditions(), "capacitanceF: expected a capacitance > 0 F, found -0.001"],
    [{ ...ok, resistanceOhm: 0 }, conditions(), "resistanceOhm: expected a pre-charge resistance > 0 Ω, found 0"],
    [{ ...ok, resistanceOhm: Number.NaN }, conditions(), "resistanceOhm: expected a pre-charge resistance > 0 Ω, found NaN"],
    [{ ...ok, sourceResistanceOhm: -1 }, conditions(), "sourceResistanceOhm: expected a source resistance ≥ 0 Ω, found -1"],
    [{ ...ok, load: { kind: "resistive", resistanceOhm: 0 } as BusLoad }, conditions(), "load.resistanceOhm: expected a load resistance > 0 Ω, found 0"],
    [{ ...ok, load: { kind: "constant-power", powerW: 10, enableV: 20, disableV: 30 } as BusLoad }, conditions(), "load.enableV: expected an enable voltage above the disable voltage (30 V), found 20"],
    [{ ...ok, load: { kind: "constant-power", powerW: 10, enableV: 20, disableV: 0 } as BusLoad }, conditions(), "load.disableV: expected a disable (under-voltage lockout) voltage > 0 V, found 0"],
    [ok, conditions({ completion: { fraction: 1, timeoutS: 1 } }), "completion.fraction: expected a fraction of the source voltage between 0 and 1 (exclusive), found 1"],
    [ok, conditions({ completion: { fraction: 0, timeoutS: 1 } }), "completion.fraction: expected a fraction of the source voltage between 0 and 1 (exclusive), found 0"],
    [ok, conditions({ completion: { fraction: 0.9, timeoutS: -1 } }), "completion.timeoutS: expected a timeout ≥ 0 s, found -1"],
    [ok, conditions({ completion: { timeoutS: 1 } }), "completion: expected a completion fraction, a withinV margin or a dwell time, found none of them"],
    [ok, conditions({ completion: { withinV: 500, timeoutS: 1 } }), "completion.withinV: expected a margin between 0 V and the source voltage (400 V), exclusive, found 500"],
    [ok, conditions({ sourceVoltageV: 0 }), "sourceVoltageV: expected a source voltage > 0 V, found 0"],
    [ok, conditions({ initialVoltageV: -5 }), "initialVoltageV: expected an initial capacitor voltage ≥ 0 V, found -5"],
  ])("%j %j → %s", (params, cond, message) => {
    expect(inputErrorMessage(() => chargeSeriesResistor(params, cond))).toBe(message);
  });
});

describe("chargeSeriesResistor: event size limit", () => {
  test("a load cycling with a tiny hysteresis for a very long timeout is refused with a clear message, not run out of memory", () => {
    const load: BusLoad = { kind: "constant-power", powerW: 500, enableV: 200, disableV: 199.5 };
    expect(() => chargeSeriesResistor({ resistanceOhm: 100, capacitanceF: 1e-3, load }, conditions({ completion: { fraction: 0.95, timeoutS: 1e4 } }))).toThrow(
      /^completion\.timeoutS: expected a timeout short enough for at most 100000 load or mode changes and 200000 power segments \(the bus switched \d+ times in the first [\d.e+-]+ s\), found 10000$/,
    );
  });
});
