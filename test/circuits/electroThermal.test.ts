import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, test } from "vitest";
import {
  type BusLoad,
  type ChargeThermalContext,
  type CircuitResult,
  type TimelineEvent,
  chargeLinearMosfet,
  defaultCircuitModels,
  runThermalHistory,
  simulateProfile,
  traceSteps,
} from "../../src/internal.js";
import { bundledText, loadAs } from "../helpers/closedLoopFixtures.js";
import { mosfetChargeAgainstNgspice, odexSolver, singleRc } from "../helpers/electroThermalReferences.js";

// Outside reference: odex (the npm package, Hairer & Wanner's ODEX), called here directly on the
// equations written out below, with no project thermal or circuit code; and closed forms of a
// single thermal RC worked in the comments (the helpers: test/helpers/electroThermalReferences.ts).

// A MOSFET current source into a shorted bus (held at 0 V): V_DS = Vs − I·Rs, with
// I(T) = (Vg − Vth − k·(T − 25 °C))/Rs. Invented values chosen for round numbers.
const VS = 100;
const RS = 10;
const VG = 4.2;
const VTH = 4;
const K = -5e-3;
const I0 = (VG - VTH) / RS; // 20 mA at 25 °C
const A = -K / RS; // dI/dT = 5e-4 A/K
const shortParams = { capacitanceF: 1e-3, gateVoltageV: VG, thresholdVoltageV: VTH, sourceResistorOhm: RS, rdsOnOhm: 0.1, thresholdTempcoVPerK: K, load: { kind: "short" } as BusLoad };
const shortConditions = (thermal: ChargeThermalContext) => ({ sourceVoltageV: VS, initialVoltageV: 0, completion: { fraction: 0.95, timeoutS: 3 }, thermal });
const currentAt = (riseK: number) => Math.max(0, VG - Math.max(0, VTH + K * riseK)) / RS;
const powerAt = (riseK: number) => (VS - currentAt(riseK) * RS) * currentAt(riseK);

/** odex on C·dx/dt = P(x) − x/Rth (x: rise over 25 °C), C = tau/Rth; x at each requested time. */
function odexRise(rth: number, tau: number, times: readonly number[]): number[] {
  const solver = odexSolver(1);
  const out: number[] = [];
  let next = 0;
  solver.solve((_t, y) => [(powerAt(y[0]!) * rth - y[0]!) / tau], 0, [0], times.at(-1)!, (_n, xOld, x, y, dense) => {
    while (next < times.length && times[next]! <= x) {
      out.push(x === xOld || dense === undefined ? y[0]! : dense(0, times[next]!));
      next++;
    }
  });
  while (out.length < times.length) out.push(out.at(-1)!);
  return out;
}

/**
 * The two-mode case both outside references run (odex and ngspice): a 400 V, 1.5 mF link charged
 * through a linear-mode MOSFET at Vg 4.6 V, Vth 3.5 V, −6 mV/K, Rs 2.2 Ω, on a Foster network of
 * 0.45 K/W, 5.4 ms and 0.5 K/W, 2 s, completing within 10 V of the bus.
 */
function twoModeCharge() {
  const [c, vs, vg, vth, rs, k, ambient] = [1.5e-3, 400, 4.6, 3.5, 2.2, -6e-3, 40];
  const tau = [0.0054, 2];
  const rf = [0.45, 0.5];
  const thermal: ChargeThermalContext = { roles: ["mosfet"], ambientC: [ambient], tauS: tau, gainKPerW: [[rf]], startRiseK: [[0, 0]] };
  const r = chargeLinearMosfet({ capacitanceF: c, gateVoltageV: vg, thresholdVoltageV: vth, sourceResistorOhm: rs, rdsOnOhm: 0.12, thresholdTempcoVPerK: k }, {
    sourceVoltageV: vs,
    initialVoltageV: 0,
    completion: { withinV: 10, timeoutS: 3 },
    thermal,
  });
  return { c, vs, vg, vth, rs, k, ambient, tau, rf, r };
}

describe("linear-mode MOSFET with threshold drift, solved with its thermal network", () => {
  test("constant parameters give today's results bit for bit: tempco 0, or no thermal context", () => {
    const base = { capacitanceF: 1.5e-3, gateVoltageV: 4.6, thresholdVoltageV: 3.5, sourceResistorOhm: 2.2, rdsOnOhm: 0.12 };
    const cond = { sourceVoltageV: 400, initialVoltageV: 0, completion: { withinV: 10, timeoutS: 3 } };
    const thermal = singleRc(1, 0.01, 40);
    const plain = chargeLinearMosfet(base, cond);
    expect(chargeLinearMosfet({ ...base, thresholdTempcoVPerK: 0 }, { ...cond, thermal })).toEqual(plain);
    expect(chargeLinearMosfet(base, { ...cond, thermal })).toEqual(plain);
    // a drifting threshold without a thermal context keeps the start temperature (25 °C here)
    expect(chargeLinearMosfet({ ...base, thresholdTempcoVPerK: -6e-3 }, cond)).toEqual(plain);
  });

  test("a bundled profile with a zero temperature coefficient simulates exactly as without one", () => {
    const text = bundledText("home-storage-400v.yaml");
    const zero = text.replace("rdsOn: 0.12 ohm", "rdsOn: 0.12 ohm\n    thresholdTempco: 0 mV/K");
    expect(zero).not.toBe(text);
    const a = simulateProfile(loadAs(text, "home-storage-400v.yaml"), { models: defaultCircuitModels });
    const b = simulateProfile(loadAs(zero, "home-storage-400v.yaml"), { models: defaultCircuitModels });
    expect(b).toEqual(a);
  });

  // Single RC, bus held at 0 V. Closed form of the loop gain (ElectroThermalSummary):
  //   G(t) = ∂P/∂T·Zth(t) = (Vs − 2·I·Rs)·(−k/Rs)·Rth·(1 − e^(−t/τ)),
  // since P = (Vs − I·Rs)·I gives ∂P/∂I = Vs − 2·I·Rs, and dI/dT = −k/Rs.
  // Equilibrium: x = Rth·P(x) with I = I0 + a·x, a quadratic
  //   −Rth·Rs·a²·x² + (Rth·a·(Vs − 2·Rs·I0) − 1)·x + Rth·I0·(Vs − Rs·I0) = 0,
  // whose smaller root is the stable one when G at DC is below 1.
  test("G at DC below 1 settles at the closed-form equilibrium, with the closed-form loop gain", () => {
    const rth = 10;
    const tau = 0.1;
    const r = chargeLinearMosfet(shortParams, shortConditions(singleRc(rth, tau, 25)));
    const qa = -rth * RS * A * A;
    const qb = rth * A * (VS - 2 * RS * I0) - 1;
    const qc = rth * I0 * (VS - RS * I0);
    const x = (-qb - Math.sqrt(qb * qb - 4 * qa * qc)) / (2 * qa); // the smaller positive root (qa < 0)
    expect(x).toBeGreaterThan(0);
    const gDc = (VS - 2 * (I0 + A * x) * RS) * A * rth;
    expect(gDc).toBeLessThan(1); // about 0.5
    const et = r.electroThermal!;
    expect(et.runaway).toBeUndefined();
    // 3 s = 30 τ with G near 0.5: settled to some 1e-6 of the rise
    expect(Math.abs(et.peakTemperatureC - 25 - x) / x).toBeLessThan(1e-5);
    // G(t) along odex's trajectory: it rises with Zth, then eases toward G at DC as the current
    // grows (the −2·I·Rs term); the largest value against the reported one
    const times = Array.from({ length: 3000 }, (_, j) => (3 * (j + 1)) / 3000);
    const rises = odexRise(rth, tau, times);
    const gains = rises.map((xi, j) => (VS - 2 * currentAt(xi) * RS) * A * rth * -Math.expm1(-times[j]! / tau));
    const gMax = Math.max(...gains);
    expect(gMax).toBeGreaterThanOrEqual(gDc);
    expect(Math.abs(et.maxLoopGain - gMax) / gMax).toBeLessThan(1e-4);
    expect(Math.abs(et.peakTemperatureC - 25 - rises.at(-1)!) / rises.at(-1)!).toBeLessThan(1e-5);
  });

  test("G at DC above 1 runs away: reported with the time and temperature where G reached 1", () => {
    const rth = 30;
    const tau = 0.1;
    expect((VS - 2 * I0 * RS) * A * rth).toBeGreaterThan(1); // 1.49 at the start
    const r = chargeLinearMosfet(shortParams, shortConditions(singleRc(rth, tau, 25)));
    const run = r.electroThermal!.runaway!;
    expect(run).toBeDefined();
    const gAt = (VS - 2 * currentAt(run.temperatureC - 25) * RS) * A * rth * -Math.expm1(-run.timeS / tau);
    expect(Math.abs(gAt - 1)).toBeLessThan(2e-3); // linear interpolation inside one step
    // odex on the same equation: the rise at that time is the reported one
    const [x] = odexRise(rth, tau, [run.timeS]);
    expect(Math.abs(run.temperatureC - 25 - x!) / x!).toBeLessThan(2e-3);
    // and it keeps climbing far past the frozen-threshold equilibrium Rth·P(0)
    const end = odexRise(rth, tau, [3])[0]!;
    expect(end).toBeGreaterThan(3 * rth * powerAt(0));
    expect(Math.abs(r.electroThermal!.peakTemperatureC - 25 - end) / end).toBeLessThan(1e-4);
  });

  test("a capacitor charge with a two-mode network matches odex on [V, y1, y2] (duration, peak, energy)", () => {
    const { c, vs, vg, vth, rs, k, ambient, tau, rf, r } = twoModeCharge();
    // the reference: linear mode all the way to 390 V (the knee sits near 397.5 V)
    const temp = (y: number[]) => ambient + rf[0]! * y[1]! + rf[1]! * y[2]!;
    const current = (y: number[]) => (vg - (vth + k * (temp(y) - 25))) / rs;
    const f = (_t: number, y: number[]) => {
      const i = current(y);
      const p = (vs - y[0]! - i * rs) * i;
      return [i / c, (p - y[1]!) / tau[0]!, (p - y[2]!) / tau[1]!, p];
    };
    const solver = odexSolver(4);
    let doneAt = NaN;
    let energy = NaN;
    let peak = -Infinity;
    solver.solve(f, 0, [0, 0, 0, 0], 3, (_n, xOld, x, y, dense) => {
      for (let j = 1; j <= 20 && dense !== undefined && x > xOld; j++) {
        const s = xOld + ((x - xOld) * j) / 20;
        peak = Math.max(peak, temp([0, dense(1, s), dense(2, s)]));
      }
      if (y[0]! >= 390 && dense !== undefined) {
        let lo = xOld;
        let hi = x;
        for (let it = 0; it < 100; it++) {
          const mid = 0.5 * (lo + hi);
          if (dense(0, mid) >= 390) hi = mid;
          else lo = mid;
        }
        doneAt = hi;
        energy = dense(3, hi);
        return false;
      }
    });
    expect(r.outcome).toBe("completed");
    expect(Math.abs(r.durationS - doneAt) / doneAt).toBeLessThan(1e-4);
    expect(Math.abs(r.energy.partsJ.mosfet! - energy) / energy).toBeLessThan(1e-4);
    expect(Math.abs(r.electroThermal!.peakTemperatureC - peak) / (peak - ambient)).toBeLessThan(2e-4);
    // the frozen threshold would have stopped well short of it
    const frozen = chargeLinearMosfet({ capacitanceF: c, gateVoltageV: vg, thresholdVoltageV: vth, sourceResistorOhm: rs, rdsOnOhm: 0.12 }, { sourceVoltageV: vs, initialVoltageV: 0, completion: { withinV: 10, timeoutS: 3 } });
    expect(frozen.durationS).toBeGreaterThan(r.durationS * 1.3);
  });

  test("the power trace handed on gives the thermal engine the coupled temperatures", () => {
    const tau = [0.0054, 2];
    const rf = [0.45, 0.5];
    const thermal: ChargeThermalContext = { roles: ["mosfet"], ambientC: [40], tauS: tau, gainKPerW: [[rf]], startRiseK: [[0, 0]] };
    const r = chargeLinearMosfet({ capacitanceF: 1.5e-3, gateVoltageV: 4.6, thresholdVoltageV: 3.5, sourceResistorOhm: 2.2, rdsOnOhm: 0.12, thresholdTempcoVPerK: -6e-3 }, {
      sourceVoltageV: 400,
      initialVoltageV: 0,
      completion: { withinV: 10, timeoutS: 3 },
      thermal,
    });
    const model = { tauS: tau, sources: ["mosfet"], observed: ["mosfet"], gainKPerW: [[rf]] };
    const summary = runThermalHistory(model, traceSteps([r.traces.mosfet]));
    expect(Math.abs(40 + summary.peakRiseK[0]! - r.electroThermal!.peakTemperatureC)).toBeLessThan(1e-3);
  });

  test.each<[string, BusLoad]>([
    ["no load", { kind: "none" }],
    ["a resistive load", { kind: "resistive", resistanceOhm: 2000 }],
    ["a constant-current load", { kind: "constant-current", currentA: 0.2, enableV: 100, disableV: 80 }],
    ["a constant-power load", { kind: "constant-power", powerW: 60, enableV: 200, disableV: 180 }],
    ["a short", { kind: "short" }],
  ])("energy balance of a coupled charge with %s: source = stored + parts + load within 1e-4", (_name, load) => {
    const r: CircuitResult = chargeLinearMosfet(
      { capacitanceF: 1.5e-3, gateVoltageV: 4.6, thresholdVoltageV: 3.5, sourceResistorOhm: 2.2, rdsOnOhm: 0.12, thresholdTempcoVPerK: -6e-3, load },
      { sourceVoltageV: 400, initialVoltageV: 50, completion: { withinV: 10, timeoutS: 2 }, thermal: singleRc(0.9, 0.05, 40) },
    );
    const e = r.energy;
    const parts = Object.values(e.partsJ).reduce((s, x) => s + x, 0);
    expect(Math.abs(e.sourceJ - e.storedJ - parts - e.loadJ)).toBeLessThan(1e-4 * Math.max(e.sourceJ, e.loadJ));
    expect(r.electroThermal).toBeDefined();
  });

  test("a bundled profile with drift carries each charge's loop gain through simulateProfile", () => {
    const text = bundledText("home-storage-400v.yaml").replace("rdsOn: 0.12 ohm", "rdsOn: 0.12 ohm\n    thresholdTempco: -6 mV/K");
    const charges: TimelineEvent[] = [];
    simulateProfile(loadAs(text, "home-storage-400v.yaml"), { models: defaultCircuitModels, onEvent: (e) => void (e.outcome !== "none" && charges.push(e)) });
    expect(charges.length).toBeGreaterThan(5);
    // every charge carries its margin (0 for one that completes at once: Zth(0) = 0)
    for (const e of charges) expect(e.electroThermal?.maxLoopGain).toBeGreaterThanOrEqual(0);
    expect(Math.max(...charges.map((e) => e.electroThermal!.maxLoopGain))).toBeGreaterThan(0.3);
  });
});

// Outside reference: ngspice (Debian package `ngspice`) with behavioural sources: the MOSFET is a
// B-source current (Vg − Vth(T))/Rs into the capacitor, whose threshold reads the thermal node's
// voltage (the rise over ambient), and its power (Vs − Vc − I·Rs)·I drives a two-stage Foster
// network; a third B-source integrates that power into a 1 F capacitor (its voltage is the energy).
// Measured when written: peak rise −3.8e-5, energy +8.9e-5 relative; the tolerance is 0.5 %.
describe("MOSFET with threshold drift against ngspice", () => {
  const work = mkdtempSync(join(tmpdir(), "heatledger-et-"));
  afterAll(() => rmSync(work, { recursive: true, force: true }));

  test("peak junction temperature rise and MOSFET energy within 0.5 %", () => {
    const { c, vs, vg, vth, rs, k, ambient, tau, rf, r } = twoModeCharge();
    const current = `((${vg}-(${vth}+(${k})*(v(j)+${ambient - 25})))/${rs})`;
    const power = `((${vs}-v(bus)-${current}*${rs})*${current})`;
    const spice = mosfetChargeAgainstNgspice(work, r, { title: "linear-mode MOSFET with threshold drift", name: "mosfet", current, power, capacitanceF: c, rf, tauS: tau });
    expect(Math.abs(spice.peakError)).toBeLessThan(5e-3);
    expect(Math.abs(spice.energyError)).toBeLessThan(5e-3);
  });
});
