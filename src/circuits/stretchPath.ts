import type { BusRegime } from "./BusRegime.js";
import { integrateBusOde } from "./integrateBusOde.js";
import type { StretchPath } from "./ProtectionMonitor.js";

/**
 * The protection monitor's view of one stretch of a bus regime that starts at attempt time
 * `startS` with the bus at `startV`: for a linear regime (h = 0) the closed form
 * V(s) = Vf + (V0 − Vf)·e^(−s/τ), Vf = g0/g1, τ = C/g1, or the ramp V0 + (g0/C)·s (g1 = 0), as in
 * the event runner; for a nonlinear one the ODE solved again from the stretch's start to each
 * time asked (odex, same tolerance as the runner), with dense current samples for the I²t.
 * Source: Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.8 (driven
 * RC circuits; section from memory).
 * Cost O(1) per voltage for a linear regime; one ODE run per voltage for a nonlinear one.
 */
export function stretchPath(regime: BusRegime, capacitanceF: number, startS: number, startV: number, durationS: number, endV: number, scaleV: number): StretchPath {
  const feed = regime.feed;
  if (regime.h === 0) {
    const exp = regime.g1 > 0;
    const vf = exp ? regime.g0 / regime.g1 : startV;
    const rate = exp ? regime.g1 / capacitanceF : 0;
    const d = exp ? startV - vf : 0;
    const k = exp ? 0 : regime.g0 / capacitanceF;
    return {
      startS, durationS, startV, endV, feed,
      closed: { vf, d, rate, k },
      voltageAt: (s) => (exp ? vf + d * Math.exp(-rate * s) : startV + k * s),
    };
  }
  return {
    startS, durationS, startV, endV, feed,
    voltageAt: (s) => (s <= 0 ? startV : integrateBusOde(regime, capacitanceF, startV, s, [], scaleV, false).endVoltageV),
    currentSamples: () => {
      const run = integrateBusOde(regime, capacitanceF, startV, durationS, [], scaleV, true);
      const list = run.samples.map((x) => ({ s: x.timeS, i: x.currentA }));
      const iEnd = feed.g0 - feed.g1 * endV + feed.h / endV;
      list.push({ s: durationS, i: iEnd });
      return list;
    },
  };
}
