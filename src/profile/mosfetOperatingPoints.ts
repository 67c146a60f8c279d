import type { CircuitSample } from "../circuits/CircuitResult.js";
import type { OperatingPoint } from "../stress/soaTable.js";
import { type PowerTrace, powerAt } from "../thermal/powerTrace.js";

/**
 * Operating points (time, Vds, Id) of a MOSFET during one charging event, from the circuit's
 * samples and the MOSFET's own power trace. The circuit models report the bus voltage and the
 * current the charging element drives into the bus, which is the MOSFET's drain current Id (it is
 * in series with the bus); they do not report Vds, so it is derived from the dissipation:
 *   Vds(t) = P_mosfet(t) / Id(t)            for Id > 0 (P = Vds·Id, exact in every regime: current
 *                                             source and fully on alike),
 *   Vds(t) = Vs − Vc(t)                       for Id = 0 (no current: nothing drops across the
 *                                             source resistor, the MOSFET holds the whole gap).
 * Source: P = V·I for a two-terminal element (Hayt, Kemmerly & Durbin, Engineering Circuit
 * Analysis, 8th ed. (2012), §2.2, section from memory); series circuit: the same current flows
 * through every element of a single loop (§3.4, section from memory).
 * @param samples the circuit's samples of the event (absolute time, as TimelineEvent.samples)
 * @param trace the MOSFET's power trace of the event (absolute time)
 * @param sourceVoltageV the source (bus) voltage Vs [V]
 * Cost O(samples × log segments).
 */
export function mosfetOperatingPoints(samples: readonly CircuitSample[], trace: PowerTrace, sourceVoltageV: number): OperatingPoint[] {
  const points: OperatingPoint[] = [];
  for (const sample of samples) {
    const idA = sample.currentA;
    let vdsV: number;
    if (idA > 0) {
      const seg = segmentAt(trace, sample.timeS);
      const powerW = seg === undefined ? 0 : powerAt(seg.terms, Math.min(seg.durationS, Math.max(0, sample.timeS - seg.startS)));
      vdsV = Math.max(0, powerW) / idA;
    } else vdsV = Math.max(0, sourceVoltageV - sample.voltageV);
    if (Number.isFinite(vdsV) && Number.isFinite(idA)) points.push({ timeS: sample.timeS, vdsV, idA: Math.max(0, idA) });
  }
  return points;
}

/** The trace segment that holds time t (the last one starting at or before t); binary search. */
function segmentAt(trace: PowerTrace, timeS: number): PowerTrace[number] | undefined {
  let lo = 0;
  let hi = trace.length - 1;
  if (hi < 0 || timeS < trace[0]!.startS) return undefined;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (trace[mid]!.startS <= timeS) lo = mid;
    else hi = mid - 1;
  }
  return trace[lo];
}

