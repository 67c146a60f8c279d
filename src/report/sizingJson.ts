import { adiabaticMassEstimates } from "../size/adiabaticMassEstimates.js";
import type { SizingReport } from "../size/sizeProfile.js";
import { reportCautions } from "../text/cautions.js";
import { networkToDocument } from "../thermal/formatNetworkFile.js";

/** A number for JSON: non-finite values become null (JSON has no Infinity). */
const num = (x: number | undefined): number | null | undefined => (x === undefined ? undefined : Number.isFinite(x) ? x : null);

/**
 * The `heatledger size --json` object: verdict (pass | warn | fail), reasons, the material,
 * what was scaled (`scale`: "whole" every heat capacity of the part's network, "element" only its
 * element capacity C1), per part the target, present peak and element capacity C1, worst event,
 * adiabatic bound and inversion (scope, scale k, capacityJPerK = the element capacity at k, massKg
 * of the element for "element" scaling, peakTemperatureC, crossingScale, sizedNetwork: the sized
 * network as a network file holds it, units on every quantity), and the circuit answer.
 * Every number is SI; Infinity is written as null; `cautions` closes it, as every JSON report.
 * Cost O(parts).
 * @example
 * const report = sizeProfile(profile("warehouse-robot-48v.yaml"), { models: defaultCircuitModels });
 * sizingJson(report).verdict // => "pass"
 */
export function sizingJson(report: SizingReport): object {
  return {
    profile: report.profileName,
    file: report.file,
    verdict: report.verdict,
    scale: report.scope,
    infeasibleReasons: report.infeasibleReasons,
    material: report.material === undefined ? null : { id: report.material.id, specificHeatJPerKgK: report.material.specificHeatJPerKgK, source: report.material.source, provenance: report.material.provenance },
    parts: report.parts.map((p) => ({
      id: p.partId,
      feasible: p.feasible,
      reason: p.reason,
      ambientC: p.ambientC,
      limitC: p.limitC,
      marginK: p.marginK,
      targetC: p.targetC,
      presentPeakC: p.presentPeakC,
      presentCapacityJPerK: num(p.presentCapacityJPerK),
      sharedWith: p.sharedWith,
      governingPartId: p.governingPartId,
      worstEvent: p.worstEvent ?? null,
      adiabatic:
        p.adiabatic === undefined
          ? null
          : {
              riseK: p.adiabatic.riseK,
              capacityJPerK: p.adiabatic.capacityJPerK,
              massKg: p.adiabatic.massKg ?? null,
              // the quick m = E/(c·ΔT) per common element and body material (empty with no energy)
              massEstimates: p.worstEvent !== undefined && p.worstEvent.energyJ > 0 && p.adiabatic.riseK > 0 ? adiabaticMassEstimates(p.worstEvent.energyJ, p.adiabatic.riseK) : [],
            },
      inversion: {
        status: p.inversion.status,
        scope: p.inversion.scope,
        scale: num(p.inversion.scale),
        capacityJPerK: num(p.inversion.capacityJPerK),
        massKg: p.inversion.massKg ?? null,
        peakTemperatureC: num(p.inversion.peakTemperatureC),
        crossingScale: p.inversion.crossingScale ?? null,
        simulations: p.inversion.simulations,
        sizedNetwork: p.inversion.sizedNetwork === undefined ? null : networkToDocument(p.inversion.sizedNetwork),
      },
    })),
    circuit:
      report.circuit === undefined
        ? null
        : {
            status: report.circuit.status,
            reason: report.circuit.reason,
            field: report.circuit.knob?.field ?? null,
            unit: report.circuit.knob?.unit ?? null,
            direction: report.circuit.knob?.direction ?? null,
            presentValue: num(report.circuit.presentValue) ?? null,
            presentChargeS: num(report.circuit.presentChargeS) ?? null,
            value: num(report.circuit.value) ?? null,
            currentA: num(report.circuit.currentA) ?? null,
            chargeS: num(report.circuit.chargeS) ?? null,
            timeoutS: report.circuit.timeoutS,
          },
    cautions: reportCautions(report.linearMosfet),
  };
}
