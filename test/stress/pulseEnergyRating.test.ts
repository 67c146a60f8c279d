import { describe, expect, test } from "vitest";
import {
  InputError,
  type PulseEnergyDerating,
  checkPulseEnergy,
  equivalentPulseDurationS,
  interpolatePulseEnergy,
  pulseEnergyDeratingFactor,
  validatePulseEnergyTable,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// An invented rating table (demo data, not any maker's part). What the checks rest on:
// - log-log interpolation between rows is common practice (rating curves are drawn on log-log axes
//   and run as near-straight lines between the rows a maker gives): the expected values below are
//   that rule's algebra, worked by hand, not values of any table;
// - the equivalent rectangular pulse t_eq = E/P_peak is common practice; the RC-charging pulse it
//   is checked on is textbook circuit analysis (Hayt, Kemmerly & Durbin, Engineering Circuit
//   Analysis, 8th ed. (2012), §8.8 driven RC circuit and §7.1 capacitor energy; sections from memory);
// - pass, fail and the table checks are the module's own definitions, checked on hand arithmetic.
const table = [
  { durationS: 1e-3, energyJ: 5 },
  { durationS: 1e-2, energyJ: 20 },
  { durationS: 1, energyJ: 400 },
];

describe("interpolatePulseEnergy", () => {
  test.each(table)("is exact at the table row %o", (row) => {
    expect(interpolatePulseEnergy(table, row.durationS)).toEqual({ energyJ: row.energyJ, position: "in-table" });
  });

  test.each([
    // [duration, expected energy], worked by hand from the rule ln E linear in ln t (common
    // practice, see the top): at the geometric mean of two durations the energy is the geometric
    // mean of their energies, sqrt(5·20) = 10 and sqrt(20·400) = 89.44...; at 10^(-1.5) s, a
    // quarter of the way from 10 ms to 1 s in log t, E = 20·(400/20)^(1/4) = 20·20^(1/4).
    [Math.sqrt(1e-3 * 1e-2), Math.sqrt(5 * 20)],
    [Math.sqrt(1e-2 * 1), Math.sqrt(20 * 400)],
    [10 ** -1.5, 20 * 20 ** 0.25],
  ])("at %d s is %d J (log-log linear)", (t, e) => {
    // closed forms in double precision; the interpolation goes through log/exp: 1e-13 relative.
    expectClose(interpolatePulseEnergy(table, t).energyJ!, e, { rel: 1e-13 });
  });

  test("log E is linear in log t between rows (three collinear points on log-log axes)", () => {
    const ts = [0.02, 0.05, 0.2];
    const le = ts.map((t) => Math.log(interpolatePulseEnergy(table, t).energyJ!));
    const lt = ts.map(Math.log);
    const slope1 = (le[1]! - le[0]!) / (lt[1]! - lt[0]!);
    const slope2 = (le[2]! - le[1]!) / (lt[2]! - lt[1]!);
    expectClose(slope1, Math.log(20) / Math.log(100), { rel: 1e-12 }); // ln(400/20)/ln(1/0.01)
    expectClose(slope2, slope1, { rel: 1e-12 });
  });

  test.each([
    [1e-4, "below-table"],
    [10, "above-table"],
  ] as const)("outside the table (%d s) gives no rating: %s", (t, position) => {
    expect(interpolatePulseEnergy(table, t)).toEqual({ energyJ: undefined, position });
  });
});

describe("equivalentPulseDurationS", () => {
  test("a rectangular pulse keeps its own duration", () => {
    expect(equivalentPulseDurationS(300 * 0.02, 300)).toBeCloseTo(0.02, 15);
  });

  test("a resistor charging a capacitor gives RC/2", () => {
    // From empty, the driven RC circuit (Hayt, Kemmerly & Durbin, 8th ed. (2012), §8.8, section
    // from memory) has i = (V/R)·e^(−t/RC), so P(t) = V²/R·e^(−2t/RC): peak V²/R, and over a full
    // charge ∫P dt = (V²/R)·RC/2 = C·V²/2 whatever R is (the capacitor's stored energy, §7.1).
    // Then t_eq = (C·V²/2)/(V²/R) = RC/2, the usual rule for such pulses (common practice).
    const V = 400;
    const R = 47;
    const C = 2e-3;
    expectClose(equivalentPulseDurationS((C * V * V) / 2, (V * V) / R), (R * C) / 2, { rel: 1e-15 });
  });
});

describe("checkPulseEnergy", () => {
  test("passes within the rating and fails past it, at t_eq = E/P_peak", () => {
    // hand arithmetic: t_eq = 15 J / 1500 W = 10 ms, a row of the table (20 J), so 15/20 = 0.75
    const ok = checkPulseEnergy(table, 15, 1500); // t_eq = 10 ms: rated 20 J
    expect(ok.status).toBe("pass");
    expect(ok.utilisation).toBeCloseTo(0.75, 15);
    const bad = checkPulseEnergy(table, 25, 2500); // t_eq = 10 ms: 125 %
    expect(bad.status).toBe("fail");
    expect(bad.ratedEnergyJ).toBe(20);
  });

  test("outside the table the status says so", () => {
    expect(checkPulseEnergy(table, 1, 1e5).status).toBe("outside-table");
  });

  test("an event with no energy passes", () => {
    expect(checkPulseEnergy(table, 0, 0).status).toBe("pass");
  });
});

describe("validatePulseEnergyTable: bad tables get clear messages", () => {
  test.each([
    [[], "ratings.pulseEnergy: expected at least one row { duration, energy }, found an empty table"],
    [
      [
        { durationS: 1e-2, energyJ: 5 },
        { durationS: 1e-3, energyJ: 20 },
      ],
      "ratings.pulseEnergy[1].duration: expected durations in increasing order (greater than 0.01 s of row 0), found 0.001 s",
    ],
    [
      [
        { durationS: 1e-3, energyJ: 20 },
        { durationS: 1e-2, energyJ: 5 },
      ],
      "ratings.pulseEnergy[1].energy: expected energies that do not fall as the duration grows (at least 20 J of row 0), found 5 J",
    ],
    [[{ durationS: 1e-3, energyJ: -1 }], "ratings.pulseEnergy[0].energy: expected an energy > 0 J, found -1"],
  ])("%j", (rows, message) => {
    expect(() => validatePulseEnergyTable(rows)).toThrow(InputError);
    expect(() => validatePulseEnergyTable(rows)).toThrow(message);
  });
});

describe("pulse-energy derating at the event's start temperature", () => {
  // E_allowed = E_rated·(T_max − T_start)/(T_max − T_ref), capped to [0, E_rated] (common practice
  // for resistor pulse ratings; src/stress/pulseEnergyRating.ts). Invented rating: 400 J for a 1 s
  // pulse from T_ref = 25 °C, nothing left at T_max = 180 °C. By hand:
  //   from  25 °C: (180 − 25)/(180 − 25)  = 1      → 400 J allowed
  //   from 102.5 °C: (180 − 102.5)/155     = 0.5    → 200 J allowed
  //   from 149 °C: (180 − 149)/155         = 0.2    →  80 J allowed
  //   from 180 °C (or hotter): 0                   →   0 J: any energy fails
  // A 150 J, 1 s pulse (t_eq = 1 s, a table row: rated exactly 400 J) uses 37.5 %, 75 %, 187.5 %
  // of the allowance and fails from 180 °C. Factors are one subtraction and one division of
  // round numbers: 1e-15 relative.
  const derating: PulseEnergyDerating = { referenceC: 25, maxTemperatureC: 180, referenceFrom: "profile", maxTemperatureFrom: "profile" };

  test.each([
    [25, 1, 400, 0.375, "pass"],
    [102.5, 0.5, 200, 0.75, "pass"],
    [149, 0.2, 80, 1.875, "fail"],
  ] as const)("from %d °C: factor %d, %d J allowed, %d of it used: %s", (startC, factor, allowedJ, use, status) => {
    const k = pulseEnergyDeratingFactor(derating, startC);
    expectClose(k, factor, { rel: 1e-15 });
    const check = checkPulseEnergy(table, 150, 150, "event", k);
    expect(check.status).toBe(status);
    expect(check.ratedEnergyJ).toBe(400);
    expectClose(check.allowedEnergyJ!, allowedJ, { rel: 1e-15 });
    expectClose(check.utilisation!, use, { rel: 1e-15 });
  });

  test("at or above T_max nothing is allowed: any energy fails, never a pass", () => {
    for (const startC of [180, 195]) {
      const k = pulseEnergyDeratingFactor(derating, startC);
      expect(k).toBe(0);
      const check = checkPulseEnergy(table, 1, 1, "event", k);
      expect([check.status, check.allowedEnergyJ, check.utilisation]).toEqual(["fail", 0, Number.POSITIVE_INFINITY]);
    }
  });

  test("below the reference no credit is taken: the factor stays 1", () => {
    expect(pulseEnergyDeratingFactor(derating, -20)).toBe(1);
  });
});
