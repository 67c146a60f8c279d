// Circuit models: time per event for the exact (linear) path and the odex (constant-power) path.
// Figures are printed for people to read, never asserted.
import { chargeConverter, chargeLinearMosfet, chargeSeriesResistor } from "../../src/internal.js";

function time(label: string, repeats: number, fn: () => { traces: Readonly<Record<string, readonly unknown[]>> }, print: (line: string) => void): void {
  fn(); // warm-up (odex module load, JIT)
  const start = performance.now();
  let segments = 0;
  for (let i = 0; i < repeats; i++) segments = Object.values(fn().traces).reduce((n, t) => n + t.length, 0);
  const each = (performance.now() - start) / repeats;
  print(`${label}: ${each < 1 ? `${(each * 1000).toFixed(1)} µs` : `${each.toFixed(2)} ms`} per event, ${segments} trace segments`);
}

export async function run(print: (line: string) => void): Promise<void> {
  const cond = { sourceVoltageV: 400, initialVoltageV: 0, completion: { fraction: 0.95, timeoutS: 2 } };
  time("series resistor, no load (exact)", 20000, () => chargeSeriesResistor({ resistanceOhm: 100, capacitanceF: 1e-3 }, cond), print);
  time("series resistor, resistive load, stall (exact)", 20000, () => chargeSeriesResistor({ resistanceOhm: 100, capacitanceF: 1e-3, load: { kind: "resistive", resistanceOhm: 1000 } }, cond), print);
  time("series resistor, constant-power load settling (odex)", 200, () => chargeSeriesResistor({ resistanceOhm: 100, capacitanceF: 1e-3, load: { kind: "constant-power", powerW: 200, enableV: 200, disableV: 150 } }, cond), print);
  time("series resistor, constant-power load cycling 2 s (odex, cached cycle)", 200, () => chargeSeriesResistor({ resistanceOhm: 100, capacitanceF: 1e-3, load: { kind: "constant-power", powerW: 500, enableV: 200, disableV: 150 } }, cond), print);
  time("linear MOSFET, no load (exact, knee)", 20000, () => chargeLinearMosfet({ capacitanceF: 1e-3, gateVoltageV: 12, thresholdVoltageV: 4, sourceResistorOhm: 4, rdsOnOhm: 50 }, cond), print);
  time("converter, constant power with limit (odex)", 500, () => chargeConverter({ capacitanceF: 1e-3, mode: "constant-power", powerW: 500, currentLimitA: 5, efficiency: 0.9 }, cond), print);
}
