import { describe, expect, test } from "vitest";
import {
  InputError,
  checkPulseEnergy,
  checkRepetitivePulse,
  energyPerOhmTable,
  equivalentPulseDurationS,
  pulseFromTrace,
  pulsePowerToEnergyTable,
  resolveStressConfig,
  validateEnergyPerOhmSeries,
  validateRepetitivePulseRule,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// The forms resistor pulse ratings are published in, each turned into the single-pulse energy
// table the checks read. The numbers are invented for the tests; every expected value is worked
// by hand in the comment beside it.

const SERIES = {
  durationsS: [0.01, 0.1],
  rows: [
    { resistanceOhm: 10, energyPerOhmJPerOhm: [30, 48] },
    { resistanceOhm: 100, energyPerOhmJPerOhm: [5, 8] },
  ],
};

describe("energy per ohm against resistance value", () => {
  test("at a row the table's own value times R", () => {
    // 10 ohm: 30 J/ohm · 10 ohm = 300 J at 10 ms, 48 · 10 = 480 J at 100 ms
    expect(energyPerOhmTable(SERIES, 10)).toEqual([
      { durationS: 0.01, energyJ: 300 },
      { durationS: 0.1, energyJ: 480 },
    ]);
  });

  test("log-log between rows, by hand at two values (common practice: ratings on log-log axes)", () => {
    // R = √(10·100) = 31.62 ohm lies halfway on a log axis: E/R = √(30·5) = √150 = 12.247 J/ohm,
    // E = 31.623 · 12.247 = 387.30 J
    expectClose(energyPerOhmTable(SERIES, Math.sqrt(1000))[0]!.energyJ, 387.298, { rel: 1e-5 });
    // R = 20 ohm: f = log10(20/10)/log10(100/10) = 0.30103; E/R = 30·(5/30)^0.30103
    // = 30·e^(−0.30103·1.79176) = 30·0.58311 = 17.493 J/ohm; E = 20 · 17.493 = 349.87 J
    expectClose(energyPerOhmTable(SERIES, 20)[0]!.energyJ, 349.868, { rel: 1e-5 });
  });

  test("a value outside the series is refused, naming the range", () => {
    expect(() => energyPerOhmTable(SERIES, 200, "parts[0].ratings.resistance")).toThrow(/parts\[0\]\.ratings\.resistance.*10 to 100 ohm/);
  });

  test("bad tables are refused, naming row and column", () => {
    expect(() => validateEnergyPerOhmSeries({ durationsS: [0.01], rows: [{ resistanceOhm: 10, energyPerOhmJPerOhm: [1, 2] }] })).toThrow(/rows\[0\]\.energyPerOhm.*one energy per ohm for each of the 1 durations/);
    expect(() => validateEnergyPerOhmSeries({ durationsS: [0.01], rows: [{ resistanceOhm: 10, energyPerOhmJPerOhm: [1] }, { resistanceOhm: 5, energyPerOhmJPerOhm: [1] }] })).toThrow(
      /rows\[1\]\.resistance.*increasing order/,
    );
  });

  test("the profile keys read the table at the part's resistance", () => {
    const config = resolveStressConfig(
      {
        ratings: {
          energyPerOhm: { durations: ["10 ms", "100 ms"], rows: [{ resistance: "10 ohm", energyPerOhm: ["30 J/ohm", "48 J/ohm"] }, { resistance: "100 ohm", energyPerOhm: [5, 8] }] },
          resistance: "20 ohm",
        },
      },
      { limitC: 300 },
    );
    expect(config.pulseEnergyForm).toBe("energy-per-ohm");
    expectClose(config.pulseEnergy![0]!.energyJ, 349.868, { rel: 1e-5 });
  });

  test("without the part's resistance the table cannot be read", () => {
    const raw = { ratings: { energyPerOhm: { durations: ["10 ms"], rows: [{ resistance: "10 ohm", energyPerOhm: ["30 J/ohm"] }] } } };
    expect(() => resolveStressConfig(raw, { field: "parts[0]" })).toThrow(InputError);
    expect(() => resolveStressConfig(raw, { field: "parts[0]" })).toThrow(/parts\[0\]\.ratings\.resistance: expected the part's resistance value/);
  });
});

describe("peak pulse power against duration", () => {
  const table = pulsePowerToEnergyTable([
    { durationS: 0.001, powerW: 250 },
    { durationS: 0.01, powerW: 50 },
  ]);

  test("a rectangular pulse carries E = P·t (Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §2.2)", () => {
    // 250 W for 1 ms = 0.25 J; 50 W for 10 ms = 0.5 J
    expect(table).toEqual([
      { durationS: 0.001, energyJ: 0.25 },
      { durationS: 0.01, energyJ: 0.5 },
    ]);
  });

  test("the equivalent rectangular pulse of an exponential one is RC/2 long (common practice)", () => {
    // 48 V through 100 ohm into 100 uF: P(t) = (V²/R)·e^(−2t/RC) (driven RC circuit, Hayt,
    // Kemmerly & Durbin, 8th ed. (2012), §8.8, section from memory), E = C·V²/2 = 0.1152 J,
    // P_peak = V²/R = 23.04 W, t_eq = E/P_peak = RC/2 = 5 ms
    const rc = 100 * 100e-6;
    const pulse = pulseFromTrace([{ startS: 0, durationS: 20 * rc, terms: [{ a: 48 ** 2 / 100, b: 0, lambda: 2 / rc }] }]);
    expectClose(pulse.energyJ, 0.1152, { rel: 1e-9 });
    expectClose(equivalentPulseDurationS(pulse.energyJ, pulse.peakPowerW), 0.005, { rel: 1e-9 });
    // read at 5 ms: f = log10(5 ms/1 ms)/log10(10) = 0.69897; E = 0.25·(0.5/0.25)^0.69897 = 0.25·1.62335
    // = 0.40584 J; use 0.1152/0.40584 = 28.39 %
    const check = checkPulseEnergy(table, pulse.energyJ, pulse.peakPowerW);
    expectClose(check.ratedEnergyJ!, 0.405836, { rel: 1e-5 });
    expectClose(check.utilisation!, 0.28386, { rel: 1e-4 });
  });

  test("a power that rises with the duration is refused as misread", () => {
    expect(() => pulsePowerToEnergyTable([{ durationS: 0.001, powerW: 10 }, { durationS: 0.01, powerW: 20 }], "parts[1].ratings.pulsePower")).toThrow(
      /parts\[1\]\.ratings\.pulsePower\[1\]\.power: expected powers that do not rise with the duration/,
    );
  });

  test("one single-pulse form per part", () => {
    const raw = { ratings: { pulseEnergy: [{ duration: "1 ms", energy: "1 J" }], pulsePower: [{ duration: "1 ms", power: "1 kW" }] } };
    expect(() => resolveStressConfig(raw, { field: "parts[0]" })).toThrow(/parts\[0\]\.ratings\.pulsePower: expected one single-pulse rating form per part/);
  });
});

describe("repetitive-pulse rule", () => {
  const byPeriod = { by: "period" as const, rows: [{ at: 10, energyJ: 250 }, { at: 100, energyJ: 600 }] };

  test("log-log in the period, derated, by hand", () => {
    // 60 s: f = log10(6) = 0.77815; 250·(600/250)^0.77815 = 250·2.4^0.77815 = 250·1.97634 = 494.09 J
    const check = checkRepetitivePulse(byPeriod, 300, 60, 0.1);
    expectClose(check.allowedEnergyJ!, 494.085, { rel: 1e-5 });
    expect(check.status).toBe("pass");
    // derated to half: 247.04 J < 300 J fails
    expect(checkRepetitivePulse(byPeriod, 300, 60, 0.1, 0.5).status).toBe("fail");
  });

  test("further apart than the rule covers: the single-pulse rating governs; closer: not covered", () => {
    expect(checkRepetitivePulse(byPeriod, 300, 1000, 0.1).position).toBe("above-table");
    expect(checkRepetitivePulse(byPeriod, 300, 1000, 0.1).status).toBe("pass");
    expect(checkRepetitivePulse(byPeriod, 300, 1, 0.1).status).toBe("outside-table");
  });

  test("by duty cycle: t_eq/period", () => {
    // 0.1 s pulses every 10 s: duty cycle 1 %, exactly the first row
    const rule = { by: "duty-cycle" as const, rows: [{ at: 0.01, energyJ: 20 }, { at: 0.1, energyJ: 5 }] };
    expect(checkRepetitivePulse(rule, 10, 10, 0.1).allowedEnergyJ).toBe(20);
    expect(() => validateRepetitivePulseRule({ by: "duty-cycle", rows: [{ at: 0.01, energyJ: 5 }, { at: 0.1, energyJ: 20 }] })).toThrow(/do not rise with the duty cycle/);
  });

  test("the profile keys: one kind of row per rule", () => {
    expect(() => resolveStressConfig({ ratings: { repetitive: [{ period: "1 s", energy: "1 J" }, { dutyCycle: 0.1, energy: "1 J" }] } }, { field: "parts[0]" })).toThrow(
      /parts\[0\]\.ratings\.repetitive\[1\]: expected a period like the first row/,
    );
  });
});
