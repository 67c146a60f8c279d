import { describe, expect, test } from "vitest";
import {
  CIPS2008_PUBLISHED,
  InputError,
  LESIT_PUBLISHED,
  NORRIS_LANDZBERG_SNPB,
  cips2008Cycles,
  cips2008Model,
  coffinMansonAccelerationFactor,
  coffinMansonCycles,
  coffinMansonModel,
  lesitCycles,
  lesitModel,
  norrisLandzbergAccelerationFactor,
  norrisLandzbergCycles,
  norrisLandzbergModel,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

const load = (rangeK: number, minC: number, heatingTimeS = 1, durationS = 2) => ({
  rangeK,
  minC,
  maxC: minC + rangeK,
  meanC: minC + rangeK / 2,
  heatingTimeS,
  durationS,
});

describe("Coffin-Manson", () => {
  const p = { referenceCycles: 1e4, referenceRangeK: 100, exponent: 4 };

  test.each([
    [100, 40],
    [100, 10],
    [60, 25],
  ])("the model's life ratio N(%d K test → %d K field) equals the closed-form AF (ΔT_t/ΔT_f)^n", (test, field) => {
    // AF = (ΔT_test/ΔT_field)^n: Coffin (1954), Manson (1953), thermal-cycling form (JEDEC JEP122).
    // e.g. (100/40)^4 = 39.0625 exactly; 1e-14 relative covers pow rounding.
    const ratio = coffinMansonCycles(p, field) / coffinMansonCycles(p, test);
    expectClose(ratio, coffinMansonAccelerationFactor(test, field, p.exponent), { rel: 1e-14 });
    expectClose(ratio, (test / field) ** 4, { rel: 1e-14 });
  });

  test("at the reference range it returns the reference life; zero range never fails", () => {
    expect(coffinMansonCycles(p, 100)).toBe(1e4);
    expect(coffinMansonCycles(p, 0)).toBe(Number.POSITIVE_INFINITY);
  });

  test.each([
    [{ ...p, exponent: -2 }, "lifetime.exponent: expected an exponent n > 0 (life falls as the range grows), found -2"],
    [{ ...p, referenceCycles: 0 }, "lifetime.referenceCycles: expected a number of cycles > 0, found 0"],
  ])("rejects %j", (bad, message) => {
    expect(() => coffinMansonModel(bad)).toThrow(InputError);
    expect(() => coffinMansonModel(bad)).toThrow(message);
  });
});

describe("Norris-Landzberg", () => {
  const p = { referenceCycles: 2000, referenceRangeK: 100, referenceFrequencyHz: 1 / 3600, referenceMaxC: 125, ...NORRIS_LANDZBERG_SNPB };

  test("the model's life ratio field/test equals the closed-form acceleration factor", () => {
    // AF = (ΔT_t/ΔT_f)^n·(f_f/f_t)^m·exp(Ea/k·(1/T_max,f − 1/T_max,t)): Norris & Landzberg (1969),
    // from memory. Field: 40 K, cycle of 6 h, max 65 °C. Written out: (100/40)^1.9 = 5.7028
    // (e^(1.9·ln 2.5) = e^(1.9·0.916291) = e^1.740952), (1/21600 / 1/3600)^(1/3) = 6^(-1/3) = 0.5503,
    // exp(1414·(1/338.15 − 1/398.15)) = exp(1414·4.45651e-4) = exp(0.630151) = 1.8779; AF = 5.8935.
    const field = load(40, 25, 3 * 3600, 6 * 3600);
    const af = norrisLandzbergAccelerationFactor(
      { rangeK: 100, frequencyHz: 1 / 3600, maxC: 125 },
      { rangeK: 40, frequencyHz: 1 / (6 * 3600), maxC: 65 },
      NORRIS_LANDZBERG_SNPB,
    );
    const closed = 2.5 ** 1.9 * 6 ** (-1 / 3) * Math.exp(1414 * (1 / 338.15 - 1 / 398.15));
    expectClose(af, closed, { rel: 1e-14 }); // same arithmetic, other order: rounding only
    expectClose(af, 5.8935, { rel: 1e-4 }); // the hand product above, kept to 5 digits
    expectClose(norrisLandzbergCycles(p, field) / 2000, af, { rel: 1e-13 }); // reference cycle at test conditions
  });

  test("negative frequency exponent is refused", () => {
    expect(() => norrisLandzbergModel({ ...p, frequencyExponent: -0.3 })).toThrow("lifetime.frequencyExponent: expected an exponent m ≥ 0, found -0.3");
  });

  test("the published solder exponents come with a warning about what they describe", () => {
    expect(norrisLandzbergModel(p).parameterWarnings[0]).toMatch(/tin-lead solder/);
  });
});

describe("LESIT (Held et al., 1997)", () => {
  test("a hand-computed point with the published parameters", () => {
    // Parameters (from memory): A = 640, α = −5, Q = 7.8e4 J/mol, with R = 8.314 J/(mol·K), the
    // value the fit was published with (LESIT_GAS_CONSTANT). ΔT = 50 K, T_m = 80 °C = 353.15 K:
    //   R·T_m = 8.314 · 353.15 = 2936.0891;  Q/(R·T_m) = 78000/2936.0891 = 26.565951
    //   e^26.565951 = 3.447038e11;  50^−5 = 1/312500000 = 3.2e−9
    //   N_f = 640 · 3.2e−9 · 3.447038e11 = 2.048e−6 · 3.447038e11 = 7.059534e5 cycles.
    // With the exact 2019-SI R = 8.314462618 the same point gives 7.04911e5, 0.15 % lower, which
    // this check refuses. 1e-6 relative: the hand arithmetic above kept 7 digits.
    expectClose(lesitCycles(LESIT_PUBLISHED, { rangeK: 50, meanC: 80 }), 7.059534e5, { rel: 1e-6 });
  });

  test("life scales as ΔT^α at fixed mean temperature", () => {
    const a = lesitCycles(LESIT_PUBLISHED, { rangeK: 40, meanC: 70 });
    const b = lesitCycles(LESIT_PUBLISHED, { rangeK: 80, meanC: 70 });
    expectClose(a / b, 2 ** 5, { rel: 1e-13 });
  });

  test("α ≥ 0 is refused: life must fall as the range grows", () => {
    expect(() => lesitModel({ ...LESIT_PUBLISHED, rangeExponent: 5 })).toThrow(
      "lifetime.rangeExponent: expected a range exponent α < 0 (life falls as the range grows), found 5",
    );
  });

  test("its fitted range is stated: ΔT 30-80 K", () => {
    expect(lesitModel(LESIT_PUBLISHED).fitted.range).toMatchObject({ min: 30, max: 80 });
  });
});

describe("CIPS 2008 (Bayerer et al., 2008)", () => {
  const part = { currentPerWireA: 10, voltageClassV: 600, wireDiameterM: 300e-6, coefficients: CIPS2008_PUBLISHED };

  test("a hand-computed point with the published parameters", () => {
    // Coefficients (from memory): K = 9.30e14, β1 = −4.416, β2 = 1285, β3 = −0.463, β4 = −0.716,
    // β5 = −0.761, β6 = −0.5. Point: ΔT = 80 K, T_min = 40 °C, t_on = 2 s, I = 10 A per wire,
    // V = 600 V (V/100 = 6), D = 300 µm.
    //   80^−4.416 = 3.944161e−9;  exp(1285/313) = 60.66891;  2^−0.463 = 0.7254761
    //   10^−0.716 = 0.1923092;  6^−0.761 = 0.2557566;  300^−0.5 = 0.05773503
    //   N_f = 9.3e14 · 3.944161e−9 · 60.66891 · 0.7254761 · 0.1923092 · 0.2557566 · 0.05773503
    //       = 4.58451e5 cycles
    // 1e-6 relative: seven-digit factors.
    expectClose(cips2008Cycles(part, { rangeK: 80, minC: 40, heatingTimeS: 2 }), 4.58451e5, { rel: 1e-6 });
  });

  test("a part outside the fitted range is evaluated with a warning, not silently", () => {
    const model = cips2008Model({ ...part, currentPerWireA: 40 });
    expect(model.parameterWarnings.some((w) => w.includes("current per bond wire 40 A is outside the fitted 3-23 A"))).toBe(true);
    expect(model.cyclesToFailure(load(80, 40, 2))).toBeGreaterThan(0);
  });

  test("β1 ≥ 0 and a missing wire diameter are refused", () => {
    expect(() => cips2008Model({ ...part, coefficients: { ...CIPS2008_PUBLISHED, beta1: 1 } })).toThrow("lifetime.beta1: expected a range exponent β1 < 0");
    expect(() => cips2008Model({ ...part, wireDiameterM: 0 })).toThrow("lifetime.wireDiameter: expected a bond wire diameter > 0 m");
  });
});
