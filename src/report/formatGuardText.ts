import type { GuardReport } from "../guard/planGuard.js";
import { verdictLine } from "../stress/Verdict.js";
import { formatCautions, wrapText } from "../text/cautions.js";
import { GUARD_CAUTION } from "../text/guardCaution.js";
import { formatDuration, formatNumber, formatTable } from "../text/formatTable.js";

/** What the command wrote, for the report's closing lines. */
export interface GuardFilesWritten {
  readonly paths: readonly string[];
}

/**
 * The text report of `heatledger guard`: the discrete model per part (time constant, decay per
 * tick, zero-order-hold and guard gains), the may-start table's tightest span, the in-between-ticks
 * figures, the comparison with the fastest safe schedule per corner, the files written, the
 * verdict and the cautions. Within `width` columns. Cost O(parts × modes + corners × attempts).
 * @example
 * const report = planGuard(profile("warehouse-robot-48v.yaml"), defaultCircuitModels);
 * formatGuardText(report, "robot.yaml", { paths: [] }).split("\n")[0] // => "Firmware thermal guard for robot.yaml: tick 1.00 ms, corners nominal."
 */
export function formatGuardText(report: GuardReport, profile: string, written: GuardFilesWritten, width = 100): string {
  const g = report.guard;
  const out: string[] = [];
  const para = (text: string): void => void out.push(wrapText(text, width).trimEnd());
  para(`Firmware thermal guard for ${profile}: tick ${formatDuration(g.tickS)}, corners ${g.corners.join(", ")}.`);
  para(
    report.fixed === null
      ? "Export: double precision (rises in K, energies in J)."
      : `Export: fixed point, rises Q${31 - report.fixed.fractionBits}.${report.fixed.fractionBits} in K (${formatNumber(2 ** -report.fixed.fractionBits, 3)} K a step), energies Q${31 - report.fixed.energyFractionBits}.${report.fixed.energyFractionBits} in J (${formatNumber(2 ** -report.fixed.energyFractionBits, 3)} J a step), gains with ${report.fixed.gainFractionBits} fractional bits.`,
  );
  para(`Energy inputs, one per heat source, fed every tick: ${g.inputs.map((x, i) => `${i}: ${x.name}`).join(", ")}.`);
  for (const c of g.channels) {
    out.push("");
    para(`Part ${c.part}: ${c.modes.tauS.length} modes, ${c.modes.tauS.length * (1 + g.inputs.length)} multiply-adds a tick.`);
    const rows = c.modes.tauS.map((tau, m) => [
      String(m + 1),
      formatNumber(tau, 4),
      c.modes.decay[m]!.toFixed(8),
      ...c.modes.zohGainKPerJ.map((row) => formatNumber(row[m]!, 5)),
      ...c.modes.boundGainKPerJ.map((row) => formatNumber(row[m]!, 5)),
    ]);
    const names = c.inputOfSource.map((i) => g.inputs[i]!.name);
    out.push(
      formatTable(
        [
          { heading: "mode" },
          { heading: "tau [s]", align: "right" },
          { heading: "decay a", align: "right" },
          ...names.map((n) => ({ heading: `ZOH ${n} [K/J]`, align: "right" as const })),
          ...names.map((n) => ({ heading: `guard ${n} [K/J]`, align: "right" as const })),
        ],
        rows,
      ).trimEnd(),
    );
    const tight = c.headroomK.reduce((best, h, j) => (h < c.headroomK[best]! ? j : best), 0);
    para(
      `May-start table: ${c.spanStartS.length} spans to ${formatDuration(c.spanStartS[c.spanStartS.length - 1]!)} after an attempt's start; the tightest span starts at ${formatDuration(c.spanStartS[tight]!)}: the decayed state may add ${formatNumber(c.headroomK[tight]!, 4)} K there (corner ${c.governing[tight]}).`,
    );
    para(
      `Between ticks: the heaviest tick carries ${c.heaviestTickJ.map((e, s) => `${formatNumber(e, 4)} J (${names[s]})`).join(", ")}; where it lands inside the tick moves the tick-end rise by up to ${formatNumber(c.placementErrorK, 3)} K above the zero-order-hold figure, covered by the guard's gain.`,
    );
  }
  out.push("");
  if (g.neverSafe) para("The first attempt alone, from ambient, crosses limit − margin in some corner: the guard never allows an attempt.");
  para(`Against the fastest safe schedule (retry planner, on the same tick; relay's shortest wait ${formatDuration(report.shortestWaitS)}), ${report.attempts} attempts:`);
  const rows = report.conservatism.map((c, i) => {
    const b = report.bursts[i]!;
    const worstLate = c.laterByS.length === 0 ? NaN : Math.max(...c.laterByS);
    return [
      c.corner,
      String(c.guardStartsS.length),
      c.fastestStartsS.length === 0 ? "n/a" : formatNumber(c.fastestStartsS[c.fastestStartsS.length - 1]!, 4),
      c.guardStartsS.length === 0 ? "n/a" : formatNumber(c.guardStartsS[c.guardStartsS.length - 1]!, 4),
      Number.isFinite(worstLate) ? formatNumber(worstLate * 1e3, 4) : "n/a",
      c.burstRatio === null ? "n/a" : formatNumber(c.burstRatio, 4),
      b.attempts.length === 0 ? "n/a" : formatNumber(Math.min(...b.attempts.map((a) => a.headroomK)), 4),
      `${formatNumber(b.leastTickMarginK, 3)}..${formatNumber(b.largestTickMarginK, 3)}`,
    ];
  });
  out.push(
    formatTable(
      [
        { heading: "corner" },
        { heading: "admitted", align: "right" },
        { heading: "fastest [s]", align: "right" },
        { heading: "guard [s]", align: "right" },
        { heading: "later [ms]", align: "right" },
        { heading: "burst x", align: "right" },
        { heading: "headroom [K]", align: "right" },
        { heading: "est − exact [K]", align: "right" },
      ],
      rows,
    ).trimEnd(),
  );
  para(
    "admitted: attempts the guard allowed; fastest, guard: the last attempt's start; later: the largest delay of an attempt against the fastest schedule; burst x: the guard's burst length over the fastest one's; headroom: limit − margin − the highest exact own peak of the admitted attempts; est − exact: the estimate less the exact rise at tick instants, least..largest (never below 0).",
  );
  const excess = Math.max(...report.bursts.map((b) => b.betweenTicksExcessK));
  para(`Between tick instants the exact rise went at most ${formatNumber(excess, 3)} K above the estimate at the end of its tick (the may-start table uses the exact peaks, so this does not admit an attempt).`);
  if (written.paths.length > 0) {
    out.push("");
    para(`Wrote ${written.paths.join(", ")}.`);
  }
  out.push("");
  para(verdictLine(report.verdict, report.verdict === "pass" ? "every attempt the guard admitted stays at or below limit − margin" : undefined));
  out.push("");
  out.push(wrapText(GUARD_CAUTION, width).trimEnd());
  out.push(formatCautions(report.linearMosfet, width).trimEnd());
  return `${out.join("\n")}\n`;
}
