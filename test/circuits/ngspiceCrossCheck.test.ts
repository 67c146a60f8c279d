import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, test } from "vitest";
import { type CircuitResult, chargeLinearMosfet, chargeSeriesResistor, powerAt } from "../../src/internal.js";
import { runNgspiceBatch } from "../helpers/electroThermalReferences.js";

// Outside reference: ngspice (Debian package `ngspice`, installed by .ci/run), a general-purpose
// circuit simulator, runs the same circuit as a netlist; we compare the capacitor voltage and the
// dissipated power at ngspice's own time points. Tolerance 5e-6 of the quantity's peak: measured
// agreement (worstRelative below, printed once when the test was written) is at most 9e-7 of the
// peak for powers (MOSFET power next to the knee) and 2e-7 for voltages; ngspice at reltol 1e-6
// writes 9 significant digits. 5e-6 is about 5x the worst measured error.

const work = mkdtempSync(join(tmpdir(), "heatledger-ngspice-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

/** Run a netlist in batch mode and read its wrdata table: one header line, then numeric rows. */
function runNgspice(name: string, netlist: string, tstop: number): Record<string, number[]> {
  // ngspice ran and its log is clean (runNgspiceBatch); the data must reach tstop
  const columns = runNgspiceBatch(work, name, netlist);
  expect(columns.time!.at(-1)).toBeCloseTo(tstop, 12);
  return columns;
}

/** Power of a role at time t, from the trace (0 in gaps). */
function traceAt(r: CircuitResult, role: string, t: number): number {
  const seg = (r.traces[role] ?? []).find((s) => t >= s.startS && t < s.startS + s.durationS) ?? (r.traces[role] ?? []).at(-1);
  return seg === undefined || t < seg.startS ? 0 : powerAt(seg.terms, Math.min(t, seg.startS + seg.durationS) - seg.startS);
}

/** Linear interpolation of a sampled column at t. */
function interpolate(times: number[], values: number[], t: number): number {
  let hi = times.findIndex((x) => x >= t);
  if (hi <= 0) hi = 1;
  const lo = hi - 1;
  const f = (t - times[lo]!) / (times[hi]! - times[lo]!);
  return values[lo]! + f * (values[hi]! - values[lo]!);
}

/** Largest deviation between two series, relative to the peak of the reference. */
function worstRelative(ours: number[], theirs: number[]): number {
  const peak = Math.max(...theirs.map(Math.abs));
  return Math.max(...ours.map((x, i) => Math.abs(x - theirs[i]!))) / peak;
}

const header = `.options reltol=1e-6 abstol=1e-12 vntol=1e-9
.control
set filetype=ascii
set wr_singlescale
set wr_vecnames
run
`;

describe("ngspice cross-check", () => {
  test("series resistor with a resistive load, from a partly charged capacitor: Vc and resistor power within 5e-6 of the peak", () => {
    const tstop = 0.5;
    const spice = runNgspice(
      "rload",
      `* series resistor, resistive load
v1 src 0 dc 400
r1 src bus 100
rl bus 0 1000
c1 bus 0 1e-3 ic=50
.tran 1e-5 ${tstop} 0 1e-4 uic
${header}wrdata rload.dat v(bus)
.endc
.end
`,
      tstop,
    );
    const r = chargeSeriesResistor(
      { resistanceOhm: 100, capacitanceF: 1e-3, load: { kind: "resistive", resistanceOhm: 1000 } },
      { sourceVoltageV: 400, initialVoltageV: 50, completion: { dwellS: tstop, timeoutS: 1 }, wantSamples: true },
    );
    const times = spice.time!;
    const spicePower = spice["v(bus)"]!.map((v) => (400 - v) ** 2 / 100);
    expect(worstRelative(times.map((t) => traceAt(r, "resistor", t)), spicePower)).toBeLessThan(5e-6);
    const samples = r.samples!.filter((s) => s.timeS >= times[0]!);
    expect(worstRelative(samples.map((s) => s.voltageV), samples.map((s) => interpolate(times, spice["v(bus)"]!, s.timeS)))).toBeLessThan(5e-6);
  });

  test("linear-mode MOSFET as a behavioural current source with Rs and a resistive load: Vc and MOSFET power within 5e-6 of the peak", () => {
    // I = min((Vg − Vth)/Rs, (Vs − Vc)/(Rs + Rds(on))) = min(2 A, v(src,bus)/54 Ω): current source
    // until the knee at 292 V, then the fully-on resistance, toward the divider 400·2000/2054 V
    const tstop = 0.6;
    const spice = runNgspice(
      "mosfet",
      `* linear-mode mosfet as a behavioural current source
v1 src 0 dc 400
b1 src s i=min(2, v(src,bus)/54)
rs s bus 4
rl bus 0 2000
c1 bus 0 1e-3 ic=0
.tran 1e-5 ${tstop} 0 1e-4 uic
${header}wrdata mosfet.dat v(bus) v(s)
.endc
.end
`,
      tstop,
    );
    const r = chargeLinearMosfet(
      { capacitanceF: 1e-3, gateVoltageV: 12, thresholdVoltageV: 4, sourceResistorOhm: 4, rdsOnOhm: 50, load: { kind: "resistive", resistanceOhm: 2000 } },
      { sourceVoltageV: 400, initialVoltageV: 0, completion: { dwellS: tstop, timeoutS: 1 }, wantSamples: true },
    );
    const times = spice.time!;
    // MOSFET power v(src, s)·i with i = (v(s) − v(bus))/Rs
    const spiceMosfet = times.map((_, i) => (400 - spice["v(s)"]![i]!) * ((spice["v(s)"]![i]! - spice["v(bus)"]![i]!) / 4));
    const spiceRs = times.map((_, i) => (spice["v(s)"]![i]! - spice["v(bus)"]![i]!) ** 2 / 4);
    expect(worstRelative(times.map((t) => traceAt(r, "mosfet", t)), spiceMosfet)).toBeLessThan(5e-6);
    expect(worstRelative(times.map((t) => traceAt(r, "sourceResistor", t)), spiceRs)).toBeLessThan(5e-6);
    const samples = r.samples!.filter((s) => s.timeS >= times[0]!);
    expect(worstRelative(samples.map((s) => s.voltageV), samples.map((s) => interpolate(times, spice["v(bus)"]!, s.timeS)))).toBeLessThan(5e-6);
  });
});
