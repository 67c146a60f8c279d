import type { SizingReport } from "../size/sizeProfile.js";
import { formatCautions, wrapText } from "../text/cautions.js";
import { verdictLine } from "../stress/Verdict.js";
import { ADIABATIC_ESTIMATE_MATERIALS, adiabaticMassEstimates } from "../size/adiabaticMassEstimates.js";
import { formatDuration, formatNumber } from "../text/formatTable.js";
import { fitTable } from "../text/fitTable.js";

const grams = (kg: number | undefined): string => (kg === undefined ? "" : formatNumber(kg * 1000));

/**
 * The terminal report of `heatledger size`: a table of heat capacities per part (adiabatic bound of
 * the worst event, then the whole-profile inversion, its words and headings naming what was scaled:
 * "whole body × k" or "element C1"), the charging-element answer, the verdict and the cautions
 * (docs/design.md, "Cautions"). Every number carries its unit in the column heading; no NaN.
 * Within 100 columns for part ids of up to 18 characters. Cost O(parts).
 * @example
 * const report = sizeProfile(profile("warehouse-robot-48v.yaml"), { models: defaultCircuitModels });
 * formatSizingText(report).split("\n")[0] // => "heatledger size: 48 V warehouse robot drive, firmware retries into a shorted bus"
 */
export function formatSizingText(report: SizingReport, width = 100): string {
  /** a table within the width: split into parts that repeat the part column when it is wider */
  const fitWidth = (columns: Parameters<typeof fitTable>[0], rows: Parameters<typeof fitTable>[1]): string => fitTable(columns, rows, { width }).text;
  const out: string[] = [];
  out.push(wrapText(`heatledger size: ${report.profileName}`, width), `profile ${report.file}`, "");
  const m = report.material;
  const whole = report.scope === "whole";
  out.push(
    wrapText(
      "Heat capacity per part. C1 is the element capacity, the one the part's own power meets first (C1 of a ladder or lumped element, " +
        "the part's source node of a graph, 1/Σ(R/tau) of a Foster network: C1 of its exact Cauer ladder). " +
        (whole
          ? "Scaled: the whole body × k, every heat capacity of the part's network at fixed thermal resistances (Foster: tau → k·tau), as for a larger part of the same build. " +
            "C1 at k is the element's share of that larger body: on the original body it is not enough when k > 1 (--scale element sizes the element alone)."
          : "Scaled: the element capacity C1 only (a Foster network is taken as its exact Cauer ladder), every other capacity and every thermal resistance as they are."),
      width,
    ),
  );
  if (m !== undefined) {
    const of = whole ? " The whole body is of several materials, so its answer is given as capacities; --scale element gives the element's mass." : "";
    out.push(wrapText(`Masses: ${m.name}, c = ${m.specificHeatJPerKgK} J/(kg·K) (${m.source}; value from memory).${of}`, width));
  }
  out.push(
    "",
    wrapText(
      "Adiabatic bound: the worst event alone, from ambient, no heat leaving (C = E/ΔT). One lump of this capacity is enough for that event by itself; " +
        "compare it with the total capacity of a network, not with its first stage C1.",
      width,
    ),
  );
  out.push(
    fitWidth(
      [
        { heading: "part" },
        { heading: "target [°C]", align: "right" },
        { heading: "worst event [J]", align: "right" },
        { heading: "ΔT [K]", align: "right" },
        { heading: "C [J/K]", align: "right" },
        ...(m === undefined ? [] : [{ heading: "m [g]", align: "right" as const }]),
      ],
      report.parts.map((p) => [
        p.partId,
        formatNumber(p.targetC),
        p.worstEvent === undefined ? "0" : formatNumber(p.worstEvent.energyJ),
        p.adiabatic === undefined ? "none" : formatNumber(p.adiabatic.riseK),
        p.adiabatic === undefined ? "none" : formatNumber(p.adiabatic.capacityJPerK),
        ...(m === undefined ? [] : [p.adiabatic === undefined ? "none" : grams(p.adiabatic.massKg)]),
      ]),
    ),
  );
  const quick = report.parts.filter((p) => p.worstEvent !== undefined && p.worstEvent.energyJ > 0 && p.adiabatic !== undefined && p.adiabatic.riseK > 0);
  if (quick.length > 0) {
    out.push(
      wrapText(
        "Quick adiabatic mass m = E/(c·ΔT) of the worst event, per material (specific heats from memory: alumina and nichrome from " +
          "Incropera et al., 7th ed., Tables A.1-A.2; ceramic and steatite typical values); the last column puts the whole-profile C1 beside the adiabatic C:",
        width,
      ),
    );
    out.push(
      fitWidth(
        [
          { heading: "part" },
          ...ADIABATIC_ESTIMATE_MATERIALS.map((id) => ({ heading: `${id} [g]`, align: "right" as const })),
          { heading: "C1 at k / C", align: "right" },
        ],
        quick.map((p) => [
          p.partId,
          ...adiabaticMassEstimates(p.worstEvent!.energyJ, p.adiabatic!.riseK).map((e) => formatNumber(e.massKg * 1000)),
          p.inversion.status === "sized" && p.adiabatic!.capacityJPerK > 0 ? formatNumber(p.inversion.capacityJPerK / p.adiabatic!.capacityJPerK) : p.inversion.status,
        ]),
      ),
    );
  }
  out.push(
    wrapText(
      `Whole profile, ${whole ? "whole body" : "element C1"} × k: the simulation inverted for the smallest k (earlier events' heat included)`,
      width,
    ),
  );
  /** a number of the inversion, or "any" / "none" when it has none */
  const answer = (p: SizingReport["parts"][number], text: () => string): string => (p.inversion.status === "sized" ? text() : p.inversion.status);
  out.push(
    whole
      ? fitWidth(
          [
            { heading: "part" },
            { heading: "peak now [°C]", align: "right" },
            { heading: "C1 now [J/K]", align: "right" },
            { heading: "whole body × k", align: "right" },
            { heading: "C1 at k [J/K]", align: "right" },
            { heading: "peak at k [°C]", align: "right" },
          ],
          report.parts.map((p) => [p.partId, formatNumber(p.presentPeakC), formatNumber(p.presentCapacityJPerK), answer(p, () => formatNumber(p.inversion.scale)), answer(p, () => formatNumber(p.inversion.capacityJPerK)), formatNumber(p.inversion.peakTemperatureC)]),
        )
      : fitWidth(
          [
            { heading: "part" },
            { heading: "peak now [°C]", align: "right" },
            { heading: "k (C1 only)", align: "right" },
            { heading: "element C1 [J/K]", align: "right" },
            ...(m === undefined ? [] : [{ heading: "element m [g]", align: "right" as const }]),
            { heading: "peak at k [°C]", align: "right" },
          ],
          report.parts.map((p) => [
            p.partId,
            formatNumber(p.presentPeakC),
            answer(p, () => formatNumber(p.inversion.scale)),
            answer(p, () => formatNumber(p.inversion.capacityJPerK)),
            ...(m === undefined ? [] : [answer(p, () => grams(p.inversion.massKg))]),
            formatNumber(p.inversion.peakTemperatureC),
          ]),
        ),
  );
  for (const p of report.parts) {
    const worst = p.worstEvent === undefined ? "no event puts energy into it" : `worst event #${p.worstEvent.index} (${p.worstEvent.label}), ${formatNumber(p.worstEvent.energyJ)} J`;
    const scaling = whole ? "scaling the whole body scales theirs" : "only this part's element is scaled";
    const shared = p.sharedWith.length === 0 ? "" : ` Shares its network with ${p.sharedWith.join(", ")}: ${scaling}, and each is held to its own target.`;
    out.push(wrapText(`${p.partId}: ${p.reason}. ${worst}; target = limit ${formatNumber(p.limitC)} °C less ${formatNumber(p.marginK)} K.${shared}${p.inversion.crossingScale === undefined ? "" : ` k = ${formatNumber(p.inversion.crossingScale)} crosses the target (${p.inversion.simulations} simulations).`}`, width));
  }
  out.push(
    wrapText(
      "The adiabatic C is one lump that keeps the worst event's whole energy: for that event alone, from ambient, it bounds C1 from above (heat that flows on into the rest of the network only helps). The whole-profile answer is the one that covers the sequence.",
      width,
    ),
    "",
  );
  const c = report.circuit;
  out.push(wrapText("Charging element (healthy power-up from 0 V, the circuit's own load, completion threshold and timeout)", width));
  if (c === undefined) out.push("no circuit in the profile");
  else if (c.knob === undefined) out.push(wrapText(`not applicable: ${c.reason}`, width));
  else {
    const unit = c.knob.unit === "ohm" ? "Ω" : c.knob.unit;
    out.push(
      fitWidth(
        [
          { heading: "value" },
          { heading: `now [${unit}]`, align: "right" },
          { heading: "charge now", align: "right" },
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
    out.push(wrapText(`${c.reason[0]!.toUpperCase()}${c.reason.slice(1)}.`, width));
  }
  out.push("");
  if (report.verdict === "pass") out.push(wrapText(verdictLine("pass", "a feasible size exists for every question asked; every sized part peaks at or below its limit less its margin"), width));
  else if (report.verdict === "warn")
    out.push(wrapText(verdictLine("warn", "a feasible size exists for every question asked, but a part sized to a smaller --margin than its profile wants peaks inside that margin, not above its limit"), width));
  else {
    out.push(verdictLine("fail", "no feasible size"));
    for (const r of report.infeasibleReasons) out.push(wrapText(`- ${r}`, width));
  }
  out.push("", formatCautions(report.linearMosfet, width));
  return out.join("\n");
}
