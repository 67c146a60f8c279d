import type { SizingReport } from "../plan/sizeProfile.js";
import { formatCautions, wrapText } from "./cautions.js";
import { formatDuration, formatNumber, formatTable } from "./formatTable.js";

const grams = (kg: number | undefined): string => (kg === undefined ? "" : formatNumber(kg * 1000));

/**
 * The terminal report of `heatledger size`: a table of heat capacities per part (adiabatic bound of
 * the worst event, then the whole-profile inversion), the charging-element answer, the verdict and
 * the cautions of DESIGN §8. Every number carries its unit in the column heading; no NaN.
 * Cost O(parts).
 */
export function formatSizingText(report: SizingReport, width = 100): string {
  const out: string[] = [];
  out.push(`heatledger size: ${report.profileName}`, `profile ${report.file}`, "");
  const m = report.material;
  out.push(
    "Heat capacity per part (every capacity of the part's network scaled by k at fixed thermal resistances;",
    "\"first capacity\" is the capacity the part's own power meets first: C1 of a ladder, 1/Σ(R/tau) of a Foster network)",
  );
  if (m !== undefined) out.push(`Masses: ${m.name}, c = ${m.specificHeatJPerKgK} J/(kg·K) (${m.source}; values from memory)`);
  out.push("");
  const columns = [
    { heading: "part" },
    { heading: "target [°C]", align: "right" as const },
    { heading: "now: peak [°C]", align: "right" as const },
    { heading: "now: C1 [J/K]", align: "right" as const },
    { heading: "worst event [J]", align: "right" as const },
    { heading: "adiabatic C [J/K]", align: "right" as const },
    ...(m === undefined ? [] : [{ heading: "adiabatic m [g]", align: "right" as const }]),
    { heading: "profile: k", align: "right" as const },
    { heading: "profile: C1 [J/K]", align: "right" as const },
    ...(m === undefined ? [] : [{ heading: "profile: m [g]", align: "right" as const }]),
    { heading: "peak at k [°C]", align: "right" as const },
  ];
  const rows = report.parts.map((p) => {
    const inv = p.inversion;
    const k = inv.status === "sized" ? formatNumber(inv.scale) : inv.status === "any" ? "any" : "none";
    return [
      p.partId,
      formatNumber(p.targetC),
      formatNumber(p.presentPeakC),
      formatNumber(p.presentCapacityJPerK),
      p.worstEvent === undefined ? "0" : formatNumber(p.worstEvent.energyJ),
      p.adiabatic === undefined ? "none" : formatNumber(p.adiabatic.capacityJPerK),
      ...(m === undefined ? [] : [p.adiabatic === undefined ? "none" : grams(p.adiabatic.massKg)]),
      k,
      inv.status === "none" ? "none" : formatNumber(inv.capacityJPerK),
      ...(m === undefined ? [] : [inv.status === "none" ? "none" : grams(inv.massKg)]),
      inv.status === "none" ? "n/a" : formatNumber(inv.peakTemperatureC),
    ];
  });
  out.push(formatTable(columns, rows));
  for (const p of report.parts) {
    const worst = p.worstEvent === undefined ? "no event puts energy into it" : `worst event #${p.worstEvent.index} (${p.worstEvent.label}, ${p.worstEvent.kind}), ${formatNumber(p.worstEvent.energyJ)} J`;
    out.push(wrapText(`${p.partId}: ${p.reason}. ${worst}; sized to ${formatNumber(p.targetC)} °C = limit ${formatNumber(p.limitC)} °C less ${formatNumber(p.marginK)} K.${p.inversion.crossingScale === undefined ? "" : ` k = ${formatNumber(p.inversion.crossingScale)} crosses the target (${p.inversion.simulations} simulations).`}`, width));
  }
  out.push(
    wrapText(
      "The adiabatic bound covers the worst event alone, from ambient, with no heat leaving; the profile column covers the whole sequence, heat left over from earlier events included.",
      width,
    ),
    "",
  );
  const c = report.circuit;
  out.push("Charging element (healthy power-up from 0 V, the circuit's own load, completion threshold and timeout)");
  if (c === undefined) out.push("no circuit in the profile");
  else if (c.knob === undefined) out.push(wrapText(`not applicable: ${c.reason}`, width));
  else {
    const unit = c.knob.unit === "ohm" ? "Ω" : c.knob.unit;
    out.push(
      formatTable(
        [
          { heading: "value" },
          { heading: `profile [${unit}]`, align: "right" },
          { heading: "profile charge", align: "right" },
          { heading: `${c.knob.direction} [${unit}]`, align: "right" },
          ...(c.currentA === undefined ? [] : [{ heading: "current [A]", align: "right" as const }]),
          { heading: "charge at it", align: "right" },
          { heading: "timeout", align: "right" },
        ],
        [
          [
            c.knob.field,
            formatNumber(c.presentValue ?? NaN),
            c.presentChargeS === undefined || !Number.isFinite(c.presentChargeS) ? "does not complete" : formatDuration(c.presentChargeS),
            c.status === "sized" ? formatNumber(c.value!) : "none",
            ...(c.currentA === undefined ? [] : [formatNumber(c.currentA)]),
            c.chargeS === undefined ? "n/a" : formatDuration(c.chargeS),
            formatDuration(c.timeoutS),
          ],
        ],
      ),
    );
    out.push(wrapText(`${c.knob.name}: ${c.reason}.`, width));
  }
  out.push("");
  if (report.verdict === "feasible") out.push("Verdict: a feasible size exists for every question asked.");
  else {
    out.push("Verdict: NO FEASIBLE SIZE:");
    for (const r of report.infeasibleReasons) out.push(wrapText(`- ${r}`, width));
  }
  out.push("", formatCautions(report.linearMosfet, width));
  return out.join("\n");
}
