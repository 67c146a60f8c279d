import { describe, expect, test } from "vitest";
import { type AttemptProtection, type BusLoad, chargeConverter, chargeSeriesResistor, createOdexSolver } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { inputErrorMessage } from "./inputErrorMessage.js";

const R = 47;
const RSRC = 0.08;
const C = 3.3e-3;
const VS = 84;
const RT = R + RSRC;
const TAU = RT * C;

const run = (load: BusLoad, protection: AttemptProtection | undefined, timeoutS = 0.7, v0 = 0) =>
  chargeSeriesResistor(
    { resistanceOhm: R, sourceResistanceOhm: RSRC, capacitanceF: C, load },
    { sourceVoltageV: VS, initialVoltageV: v0, completion: { fraction: 0.92, timeoutS, ...(protection === undefined ? {} : { protection }) } },
  );

describe("protection inside an attempt: bus checks", () => {
  // Energy before a bus check fires into a short: the short holds the bus at 0 V, so the resistor
  // carries the constant current Vs/(R + Rsrc) and takes P = Vs²·R/(R + Rsrc)² (Joule heating,
  // Hayt, Kemmerly & Durbin, 8th ed. (2012), §2.4, from memory): the energy is P·t at the check.
  test("into a short, a bus check at t fires at t and the part takes P·t", () => {
    const t = 0.01;
    const r = run({ kind: "short" }, { busChecks: [{ atS: t, minV: 45 }] });
    expect(r.outcome).toBe("tripped");
    expect(r.trippedBy?.kind).toBe("bus-check");
    expect(r.durationS).toBe(t);
    expect(r.reason).toContain("below 45 V");
    const p = (VS * VS * R) / (RT * RT);
    expectClose(r.energy.partsJ.resistor!, p * t, { rel: 1e-12 });
  });

  // A partial fault (a resistive load RL across the bus): Thévenin (Hayt et al., §5.3, from memory)
  // gives the driven RC charge V = Vf·(1 − e^(−t/τ)), Vf = Vs·RL/(Rt + RL), τ = C·Rt·RL/(Rt + RL)
  // (§8.8, from memory); the resistor takes ∫(Vs − V)²·R/Rt² dt, integrated here term by term by hand.
  test("into a partial fault the energy before the check is the RC closed form", () => {
    const rl = 20;
    const vf = (VS * rl) / (RT + rl);
    const tau = (C * RT * rl) / (RT + rl);
    const t = 0.05;
    const r = run({ kind: "resistive", resistanceOhm: rl }, { busChecks: [{ atS: t, minV: 45 }] });
    expect(r.outcome).toBe("tripped");
    expectClose(r.endVoltageV, vf * (1 - Math.exp(-t / tau)), { rel: 1e-12 });
    const a = VS - vf;
    const integral = a * a * t + 2 * a * vf * tau * (1 - Math.exp(-t / tau)) + ((vf * vf * tau) / 2) * (1 - Math.exp((-2 * t) / tau));
    expectClose(r.energy.partsJ.resistor!, (integral * R) / (RT * RT), { rel: 1e-10 });
  });

  // On a healthy RC charge from 0 V the bus reaches V at t* = −RC·ln(1 − V/Vs) (Hayt et al.,
  // §8.8, from memory): a "below V" check just before t* fires, one just after does not.
  test("a check on a charging RC bus fires exactly before t = −RC·ln(1 − V/Vs)", () => {
    const level = 40;
    const tStar = -TAU * Math.log(1 - level / VS);
    const before = run({ kind: "none" }, { busChecks: [{ atS: tStar * (1 - 1e-9), minV: level }] }, 2);
    expect(before.outcome).toBe("tripped");
    const after = run({ kind: "none" }, { busChecks: [{ atS: tStar * (1 + 1e-9), minV: level }] }, 2);
    expect(after.outcome).toBe("completed");
    // a rise-too-fast check at the same time: above the level just after t*
    const fast = run({ kind: "none" }, { busChecks: [{ atS: tStar * (1 + 1e-9), maxV: level }] }, 2);
    expect(fast.outcome).toBe("tripped");
  });

  // The mean rise over [t1, t2] of V = Vs·(1 − e^(−t/τ)) is Vs·(e^(−t1/τ) − e^(−t2/τ))/(t2 − t1)
  // (§8.8, from memory): a rise check asking 1e-9 more fires, one asking 1e-9 less does not.
  test("a rise check compares the mean rise rate with the closed form", () => {
    const t1 = 0.01;
    const t2 = 0.05;
    const rate = (VS * (Math.exp(-t1 / TAU) - Math.exp(-t2 / TAU))) / (t2 - t1);
    expect(run({ kind: "none" }, { riseChecks: [{ fromS: t1, toS: t2, minRateVPerS: rate * (1 + 1e-9) }] }, 2).outcome).toBe("tripped");
    expect(run({ kind: "none" }, { riseChecks: [{ fromS: t1, toS: t2, minRateVPerS: rate * (1 - 1e-9) }] }, 2).outcome).toBe("completed");
  });
});

describe("protection inside an attempt: current, I²t, on-time", () => {
  // Over-current with a delay on an RC charge: i = (Vs/Rt)·e^(−t/τ) (Hayt et al., §8.8, from
  // memory) stays above I until tx = τ·ln(Vs/(Rt·I)); a delay shorter than tx trips at the delay.
  test("over-current trip: fires at the delay when the current is still above the level", () => {
    const level = 1;
    const tx = TAU * Math.log(VS / (RT * level));
    const trips = run({ kind: "none" }, { overCurrent: { currentA: level, delayS: tx * (1 - 1e-9) } }, 2);
    expect(trips.outcome).toBe("tripped");
    expect(trips.trippedBy?.kind).toBe("over-current");
    expectClose(trips.durationS, tx * (1 - 1e-9), { rel: 1e-12 });
    expect(run({ kind: "none" }, { overCurrent: { currentA: level, delayS: tx * (1 + 1e-9) } }, 2).outcome).toBe("completed");
  });

  // A rectangular pulse I for t has I²t = I²·t (hand integral): a fuse of I²t = L into a short
  // (constant I = Vs/Rt) melts at L/I².
  test("fuse: a rectangular pulse melts it at L/I²", () => {
    const i = VS / RT;
    const limit = 1.2;
    const r = run({ kind: "short" }, { i2t: [{ limitA2s: limit, kind: "fuse" }] });
    expect(r.outcome).toBe("tripped");
    expect(r.trippedBy?.kind).toBe("fuse");
    expectClose(r.durationS, limit / (i * i), { rel: 1e-12 });
  });

  // An exponential pulse i = I0·e^(−t/τ) has ∫i² dt = I0²·τ/2·(1 − e^(−2t/τ)) (hand integral):
  // a firmware I²t limit L < I0²τ/2 fires at t = −(τ/2)·ln(1 − 2L/(I0²τ)).
  test("firmware I²t: an exponential pulse reaches L at −(τ/2)·ln(1 − 2L/(I0²·τ))", () => {
    const i0 = VS / RT;
    const total = (i0 * i0 * TAU) / 2;
    const limit = 0.6 * total;
    const r = run({ kind: "none" }, { i2t: [{ limitA2s: limit, kind: "firmware" }] }, 2);
    expect(r.outcome).toBe("tripped");
    expect(r.trippedBy?.kind).toBe("firmware-i2t");
    expectClose(r.durationS, -(TAU / 2) * Math.log(1 - limit / total), { rel: 1e-10 });
    // the whole pulse is below a limit of 1.01·I0²τ/2: it never fires
    expect(run({ kind: "none" }, { i2t: [{ limitA2s: 1.01 * total, kind: "firmware" }] }, 2).outcome).toBe("completed");
  });

  test("maximum on-time ends the attempt at that time, before the timeout", () => {
    const r = run({ kind: "short" }, { maxOnTimeS: 0.123 });
    expect(r.outcome).toBe("tripped");
    expect(r.trippedBy?.kind).toBe("max-on-time");
    expect(r.durationS).toBe(0.123);
  });

  // A nonlinear bus (a constant-current converter into a constant-power load; the feed is a
  // constant current Ic, so ∫i² dt = Ic²·t whatever the bus does): the I²t of a fuse fires at L/Ic².
  // The bus voltage at a check against odex integrating C·dV/dt = Ic − P/V on its own
  // (Hairer, Nørsett & Wanner, 2nd ed. (1993), §II.9, from memory).
  test("on an ODE regime the check reads the bus the ODE gives, and the fuse fires at L/Ic²", () => {
    const ic = 3;
    const load: BusLoad = { kind: "constant-power", powerW: 60, enableV: 30, disableV: 25 };
    const conv = (protection: AttemptProtection) =>
      chargeConverter({ capacitanceF: 1e-3, mode: "constant-current", currentA: ic, efficiency: 1, load }, { sourceVoltageV: 84, initialVoltageV: 40, completion: { fraction: 0.95, timeoutS: 5, protection } });
    const fuse = conv({ i2t: [{ limitA2s: 0.05, kind: "fuse" }] });
    expect(fuse.outcome).toBe("tripped");
    expectClose(fuse.durationS, 0.05 / (ic * ic), { rel: 1e-9 });
    const t = 0.01;
    const check = conv({ busChecks: [{ atS: t, minV: 80 }] });
    expect(check.outcome).toBe("tripped");
    const solver = createOdexSolver(1);
    solver.relativeTolerance = 1e-12;
    solver.absoluteTolerance = 1e-12;
    const y = solver.solve((_x, [v]) => [(ic - 60 / v!) / 1e-3], 0, [40], t).y[0]!;
    expectClose(check.endVoltageV, y, { rel: 1e-8 });
  });

  test("bad protection values are refused naming the field", () => {
    expect(inputErrorMessage(() => run({ kind: "short" }, { busChecks: [{ atS: -1, minV: 4 }] }))).toContain("completion.protection.busChecks[0].atS");
    expect(inputErrorMessage(() => run({ kind: "short" }, { i2t: [{ limitA2s: 0, kind: "fuse" }] }))).toContain("completion.protection.i2t[0].limitA2s");
  });
});
