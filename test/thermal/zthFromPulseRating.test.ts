import { describe, expect, test } from "vitest";
import {
  type FosterNetwork,
  InputError,
  PULSE_RATING_ASSUMPTIONS,
  constantPowerSegment,
  fitFosterNetwork,
  fosterToModal,
  logSpacedTimes,
  runThermalHistory,
  traceSteps,
  zth,
  zthFromPulseRating,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// An invented wirewound-resistor-like Foster network (wire, core, housing, plate).
const KNOWN: FosterNetwork = {
  kind: "foster",
  stages: [
    { rKPerW: 0.35, tauS: 0.04 },
    { rKPerW: 0.9, tauS: 1.8 },
    { rKPerW: 1.6, tauS: 45 },
    { rKPerW: 2.2, tauS: 600 },
  ],
};
const model = fosterToModal(KNOWN);
const START_C = 25;
const MAX_C = 275;

/**
 * The rating table a maker would publish for KNOWN: for each pulse length, the energy of the
 * rectangular pulse whose peak reaches MAX_C from START_C. Found by simulating a 1 W pulse with the
 * exact modal engine (runThermalHistory, not the Zth formula) and scaling by linearity:
 * E_max = P_max·t_p with P_max = ΔT / peak_rise(1 W).
 */
function ratingTable(durations: readonly number[]): { durationS: number; energyJ: number }[] {
  return durations.map((tp) => {
    const run = runThermalHistory(model, traceSteps([[constantPowerSegment(0, tp, 1)]], 0, 2 * tp));
    return { durationS: tp, energyJ: ((MAX_C - START_C) / run.peakRiseK[0]!) * tp };
  });
}

describe("zthFromPulseRating", () => {
  const durations = logSpacedTimes(1e-3, 2000, 25);
  const table = ratingTable(durations);

  test("zthFromPulseRating on a table generated from a known network gives that network's Zth back", () => {
    const points = zthFromPulseRating(table, { startC: START_C, maxC: MAX_C });
    // Zth(t_p) = ΔT·t_p/E_max inverts the generation exactly; 1e-12 relative is rounding in the
    // engine's expm1 sums and the two divisions.
    points.forEach((p, i) => {
      expect(p.timeS).toBe(durations[i]);
      expectClose(p.zthKPerW, zth(model, p.timeS), { rel: 1e-12 });
    });
  });

  test("the table converted and fitted reproduces the known network's Zth over the table's range", () => {
    const fit = fitFosterNetwork(zthFromPulseRating(table, { startC: START_C, maxC: MAX_C }));
    const fitted = fosterToModal(fit.network);
    // exact data: the fit reaches rounding level, measured 4.2e-16 relative at worst over the 200
    // times (printed when the tolerance was set); 2e-15 is about 5x that. Node's Math functions
    // are V8's own, so the figure does not depend on the platform.
    for (const t of logSpacedTimes(1e-3, 2000, 200)) expectClose(zth(fitted, t), zth(model, t), { rel: 2e-15 });
  });

  test("for pulses much shorter than every tau the rated energy tends to C·ΔT (adiabatic limit)", () => {
    // One stage R = 2 K/W, C = 0.5 J/K (tau 1 s): a 1 µs pulse heats adiabatically, so
    // E_max → C·ΔT = 0.5 J/K · 250 K = 125 J and Zth(t_p) → t_p/C.
    // Source: Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.1 and
    // §5.3 (lumped capacitance with negligible outflow). Relative gap t_p/(2·tau) = 5e-7 sets 1e-6.
    const one = fosterToModal({ kind: "foster", stages: [{ rKPerW: 2, tauS: 1 }] });
    const tp = 1e-6;
    const energy = (250 * tp) / zth(one, tp);
    expectClose(energy, 125, { rel: 1e-6 });
    const [point] = zthFromPulseRating([{ durationS: tp, energyJ: energy }], { startC: 25, maxC: 275 });
    expectClose(point!.zthKPerW, tp / 0.5, { rel: 1e-6 });
  });

  test("PULSE_RATING_ASSUMPTIONS names rectangular pulses, the transition, linearity and constant properties", () => {
    const text = PULSE_RATING_ASSUMPTIONS.join(" ");
    for (const word of ["rectangular", "adiabatic", "steady state", "linear", "constant properties"]) expect(text).toContain(word);
  });

  test.each([
    ["durations not increasing", [{ durationS: 0.1, energyJ: 10 }, { durationS: 0.1, energyJ: 12 }], { startC: 25, maxC: 275 }, "table[1].duration: expected a duration longer than the previous row's 0.1 s (durations must increase), found 0.1"],
    ["a negative energy", [{ durationS: 0.1, energyJ: -10 }], { startC: 25, maxC: 275 }, "table[0].energy: expected a pulse energy > 0 J, found -10"],
    ["a longer pulse rated for less energy", [{ durationS: 0.1, energyJ: 10 }, { durationS: 1, energyJ: 8 }], { startC: 25, maxC: 275 }, "table[1].energy: expected an energy of at least the previous row's 10 J (a longer pulse cannot be rated for less energy), found 8"],
    ["a longer pulse rated for more power", [{ durationS: 0.1, energyJ: 10 }, { durationS: 0.2, energyJ: 30 }], { startC: 25, maxC: 275 }, "table[1].energy: expected a rated power E/t_p of at most the previous row's 100 W (a longer pulse cannot carry more power), found 30 J in 0.2 s = 150 W"],
    ["a maximum below the start", [{ durationS: 0.1, energyJ: 10 }], { startC: 25, maxC: 20 }, "maxTemperature: expected a maximum element temperature above the start temperature 25 °C, found 20"],
  ] as const)("zthFromPulseRating rejects %s", (_, rows, conditions, message) => {
    try {
      zthFromPulseRating(rows, conditions);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(InputError);
      expect((error as InputError).message).toBe(message);
    }
  });
});
