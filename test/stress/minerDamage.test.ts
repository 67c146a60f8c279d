import { describe, expect, test } from "vitest";
import { InputError, MinerAccumulator, coffinMansonModel, rainflow } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// Coffin-Manson with round parameters so damages are easy to write out: N_f = 1e4·(100/ΔT)^2.
const model = coffinMansonModel({ referenceCycles: 1e4, referenceRangeK: 100, exponent: 2, fitted: { range: { min: 20, max: 150, origin: "test" } } });
const pts = (values: readonly number[]) => values.map((value, i) => ({ timeS: i, value }));

function damageOf(values: readonly number[], mode: "open" | "repeating" = "repeating"): number {
  const acc = new MinerAccumulator(model);
  for (const c of rainflow(pts(values), { mode })) acc.add(c);
  return acc.damage;
}

describe("MinerAccumulator (Miner 1945, linear damage rule)", () => {
  test("damage is Σ count/N_f, life is 1/D repetitions and 1/(D·rate) years", () => {
    // Repeating history 25, 125, 75, 105, 25 (°C): cycles 100 K (N_f = 1e4) and 30 K (N_f = 1e4/0.09).
    // D = 1/1e4 + 0.09/1e4 = 1.09e-4; 1/D = 9174.31...; at 1000 repetitions a year, 9.17431 years.
    const acc = new MinerAccumulator(model);
    for (const c of rainflow(pts([25, 125, 75, 105, 25]), { mode: "repeating" })) acc.add(c);
    const r = acc.result(1000);
    expectClose(r.damagePerRepetition, 1.09e-4, { rel: 1e-14 }); // two terms, rounding only
    expectClose(r.repetitionsToEndOfLife, 1 / 1.09e-4, { rel: 1e-14 });
    expectClose(r.yearsToEndOfLife!, 1 / 1.09e-4 / 1000, { rel: 1e-14 });
    expect(r.topCycles.map((t) => t.cycle.rangeK)).toEqual([100, 30]);
    expectClose(r.topCycles[0]!.share, 1 / 1.09, { rel: 1e-14 });
  });

  test("additivity: two profiles run back to back as one repeating history give twice the damage of one", () => {
    // Rainflow of a closed history repeated twice has every cycle twice (checked in the rainflow
    // tests), so Miner's sum doubles exactly.
    const a = [25, 125, 60, 110, 40, 90, 25];
    expectClose(damageOf([...a, ...a]), 2 * damageOf(a), { rel: 1e-14 });
  });

  test("additivity: cycles of two histories in one accumulator sum their separate damages", () => {
    const a = rainflow(pts([20, 90, 40, 70, 20]), { mode: "open" });
    const b = rainflow(pts([30, 140, 35, 100, 60]), { mode: "open" });
    const both = new MinerAccumulator(model);
    [...a, ...b].forEach((c) => both.add(c));
    const sa = new MinerAccumulator(model);
    a.forEach((c) => sa.add(c));
    const sb = new MinerAccumulator(model);
    b.forEach((c) => sb.add(c));
    expectClose(both.damage, sa.damage + sb.damage, { rel: 1e-15 });
  });

  test("cycles outside the fitted range are counted and reported with their share of the damage", () => {
    // Repeating history 25, 125, 115, 120, 25: cycles 100 K (N_f = 1e4) and 5 K (N_f = 4e6, outside
    // 20-150 K). Share of the 5 K cycle: (1/4e6)/(1/1e4 + 1/4e6) = 1/401.
    const acc = new MinerAccumulator(model);
    for (const c of rainflow(pts([25, 125, 115, 120, 25]), { mode: "repeating" })) acc.add(c);
    const r = acc.result();
    expect(r.warnings).toEqual([]);
    expect(r.extrapolated).toHaveLength(1);
    const x = r.extrapolated[0]!;
    expect([x.quantity, x.unit, x.range, x.origin, x.found, x.cycles]).toEqual(["range", "K", [20, 150], "test", [5, 5], 1]);
    expectClose(x.damageShare, 1 / 401, { rel: 1e-14 }); // two terms, rounding only
  });

  test("a model with no validity range says its cycles could not be checked", () => {
    const bare = coffinMansonModel({ referenceCycles: 1e4, referenceRangeK: 100, exponent: 2 });
    const acc = new MinerAccumulator(bare);
    for (const c of rainflow(pts([25, 125, 25]), { mode: "repeating" })) acc.add(c);
    const r = acc.result();
    expect(r.extrapolated).toEqual([]);
    expect(r.warnings).toEqual(["Coffin-Manson: no validity range, published or given (lifetime.fittedRange), so the cycles cannot be checked against one"]);
  });

  test("a compensated sum keeps a million tiny damages exact to rounding", () => {
    const acc = new MinerAccumulator(model, 0);
    const cycle = { rangeK: 1, meanC: 50, minC: 49.5, maxC: 50.5, count: 1 as const, heatingTimeS: 1, durationS: 2, startS: 0 };
    for (let i = 0; i < 1_000_000; i++) acc.add(cycle);
    // each 1/(1e4·1e4) = 1e-8; 1e6 of them = 0.01. A plain sum drifts by ~1e-12 relative; compensated: ~1e-16.
    expectClose(acc.damage, 0.01, { rel: 1e-15 });
  });

  test("a bad rate is refused", () => {
    expect(() => new MinerAccumulator(model).result(-3)).toThrow(InputError);
    expect(() => new MinerAccumulator(model).result(-3)).toThrow("repetitionsPerYear: expected a rate > 0 per year, found -3");
  });
});
