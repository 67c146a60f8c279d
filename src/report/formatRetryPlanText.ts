import { formatCautions, wrapText } from "../text/cautions.js";
import { verdictLine } from "../stress/Verdict.js";
import type { GoverningCorner } from "../retry/GoverningCorner.js";
import { lockoutMapHeatmap } from "./formatLockoutMap.js";
import type { RetryPlanReport } from "../retry/planRetries.js";
import type { FeasibleBand } from "../retry/scanFeasibleBands.js";

/** A duration for people: ms below 1 s, s below 2 min, else min. */
export function formatPlanDuration(s: number): string {
  if (s === 0) return "0 s";
  if (s < 1) return `${Number((s * 1000).toPrecision(3))} ms`;
  if (s < 120) return `${Number(s.toPrecision(3))} s`;
  return `${Number((s / 60).toPrecision(3))} min`;
}

function corner(g: GoverningCorner): string {
  return `governing corner "${g.corner}": ${g.peakC.toFixed(1)} °C against limit − margin ${g.allowedC.toFixed(1)} °C (limit ${g.limitC.toFixed(1)} °C)`;
}

/** ", back-off ×1.5 up to 10 s" (", back-off ×2, no longest interval" when the profile sets none); "" without back-off. */
export function backoffWords(backoff: number, maxIntervalS: number): string {
  if (!(backoff > 1)) return "";
  return Number.isFinite(maxIntervalS) ? `, back-off ×${backoff} up to ${formatPlanDuration(maxIntervalS)}` : `, back-off ×${backoff}, no longest interval`;
}

/** A paragraph wrapped to `width`, its first line after `lead` and the others under its text. */
function wrapped(lead: string, text: string, width: number): string {
  return wrapText(text, width - lead.length)
    .split("\n")
    .map((line, i) => (i === 0 ? lead : " ".repeat(lead.length)) + line)
    .join("\n");
}

function bands(list: readonly FeasibleBand[]): string {
  return list.map((b) => (b.openEnded ? `${formatPlanDuration(b.fromS)} and longer` : `${formatPlanDuration(b.fromS)} to ${formatPlanDuration(b.toS)}`)).join("; ");
}

/**
 * The terminal report of `heatledger retries`: the profile's own policy verdict first (pass, warn
 * or fail, src/stress/Verdict.ts; the burst and the repeated cycle each with its own word), then
 * every answer (items 1-6 of the retry planner) with a sentence on how to read it and the corner
 * that governs it, the lockout map as a heat map, and the cautions (docs/design.md, "Cautions").
 * Cost O(attempts + map cells).
 * @example
 * const plan = planRetries(profile("warehouse-robot-48v.yaml"), defaultCircuitModels);
 * formatRetryPlanText(plan).split("\n")[0] // => 'Retry plan for the fault "shorted-output" (events[1].retry)'
 */
export function formatRetryPlanText(report: RetryPlanReport, width = 100): string {
  const { setup, policy } = report;
  const out: string[] = [];
  const r = setup.retry;
  out.push(`Retry plan for the fault "${setup.fault.type}" (${r.field})`);
  out.push(`Corners: ${setup.corners.join(", ")}. Parts watched: ${setup.parts.join(", ")}.`);
  out.push("Safe means: every attempt's peak at or below the part's limit less its design margin, in every");
  out.push("corner. The profile's own policy gets a verdict: pass (safe), warn or fail, as in every command.");
  const t = setup.timing;
  out.push(
    `Relay: operate ${formatPlanDuration(t.operateS)}, release ${formatPlanDuration(t.releaseS)}; firmware timer ${t.timerResolutionS > 0 ? formatPlanDuration(t.timerResolutionS) : "not rounded"}.`,
    `No wait between attempts is shorter than ${formatPlanDuration(setup.shortestWaitS)}; every interval, wait and lockout below`,
    "is a whole number of timer steps, checked by simulation at that value.",
  );
  out.push("");
  out.push(
    wrapped("", `Profile policy: ${r.attempts} attempt${r.attempts === 1 ? "" : "s"} every ${formatPlanDuration(r.intervalS)} (start to start${backoffWords(r.backoff, r.maxIntervalS)}), then a ${formatPlanDuration(r.lockoutS)} lockout.`, width),
  );
  out.push(wrapped("  ", verdictLine(policy.verdict), width));
  out.push(wrapped("  ", `One burst from a cold part: ${policy.burstVerdict}; ${corner(policy.burst)}.`, width));
  out.push(wrapped("  ", `Burst + lockout repeated while the fault persists: ${policy.cyclesVerdict}; ${corner(policy.cycles)}.`, width));
  for (const reason of policy.reasons) out.push(wrapped("  - ", reason, width));
  out.push("");

  const u = report.uniformInterval;
  out.push(`1. Shortest uniform retry interval for ${u.attempts} attempts (${u.spacing}):`);
  if (u.minimumIntervalS === null) out.push(`   none up to ${formatPlanDuration(u.scannedToS)}: even widely spaced attempts are unsafe; ${corner(u.governing)}.`);
  else {
    out.push(`   ${formatPlanDuration(u.minimumIntervalS)}; ${corner(u.governing)}.`);
    if (u.bands.length > 1) out.push(`   Safe intervals form ${u.bands.length} separate bands: ${bands(u.bands)}. Between them, attempts find the capacitor emptied while the part is still hot.`);
  }
  out.push("");

  const m = report.maxAttempts;
  out.push(`2. Most attempts at an interval of ${formatPlanDuration(setup.intervalS)} (${setup.spacing}):`);
  if (m === null)
    out.push(`   not defined: ${setup.spacing === "start-to-start" ? "the interval is shorter than one attempt plus" : "the wait is shorter than"} the ${formatPlanDuration(setup.shortestWaitS)} the relay needs.`);
  else if (m.unlimited) out.push(`   unlimited: retrying for ever at this interval is safe; ${corner(m.governing)}.`);
  // a capped count has no unsafe attempt to name (firstUnsafePeakC is null)
  else if (m.firstUnsafePeakC === null) out.push(`   ${m.attempts} or more (the count was capped); ${corner(m.governing)}.`);
  else out.push(`   ${m.attempts}; attempt ${m.attempts! + 1} would reach ${m.firstUnsafePeakC.toFixed(1)} °C in corner "${m.governing.corner}" (limit − margin ${m.governing.allowedC.toFixed(1)} °C).`);
  out.push("");

  const f = report.forever;
  out.push(`3. Shortest interval for retrying for ever (${f.spacing}), from the periodic steady state:`);
  if (f.minimumIntervalS === null) out.push(`   none up to ${formatPlanDuration(f.scannedToS)}; ${corner(f.governing)}.`);
  else {
    out.push(`   ${formatPlanDuration(f.minimumIntervalS)}; ${corner(f.governing)}${f.proven ? "" : " (not proven in closed form: checked by simulation only)"}.`);
    if (f.bands.length > 1) out.push(`   Safe bands: ${bands(f.bands)}.`);
  }
  out.push("");

  const s = report.fastest;
  out.push(`4. Fastest safe schedule of ${s.requestedAttempts} attempts (each at the earliest moment its own peak stays safe):`);
  out.push("   attempt   start      wait after previous   ratio    peak [°C]   governing corner");
  for (const a of s.schedule) {
    out.push(
      `   ${String(a.attempt).padStart(7)}   ${formatPlanDuration(a.startS).padEnd(9)}  ${(a.waitS === null ? "-" : formatPlanDuration(a.waitS)).padEnd(20)}  ${(a.ratio === null ? "-" : a.ratio.toFixed(2)).padEnd(7)}  ${a.governing.peakC.toFixed(1).padStart(9)}   ${a.governing.corner}`,
    );
  }
  if (s.stoppedBecause !== null) out.push(`   Stopped: ${s.stoppedBecause}.`);
  if (s.schedule.length === s.requestedAttempts && s.schedule.every((a) => a.waitS === null || a.waitS <= s.shortestWaitS))
    out.push(`   Every attempt may start as soon as the relay allows, ${formatPlanDuration(s.shortestWaitS)} after the previous one ends:`, "   no longer wait or back-off is needed for this many attempts.");
  if (s.impliedBackoffRatio !== null) out.push(`   Implied back-off: the positive waits grow by ×${s.impliedBackoffRatio.toFixed(3)} per attempt on average.`);
  const b = report.backoff;
  if (b?.rule != null) {
    out.push(
      `   Firmware rule: wait ${formatPlanDuration(b.rule.firstWaitS)} after the first attempt ends, then multiply the wait by ${b.rule.growthFactor.toFixed(3)} after each attempt (rounded up to the timer); checked by simulation: the burst ends at ${formatPlanDuration(b.burstEndS!)} (fastest: ${formatPlanDuration(s.burstEndS)}); ${corner(b.governing)}.`,
    );
  } else if (b !== null) out.push(`   No first wait and growth factor up to the scanned range keeps all ${b.attempts} attempts safe.`);
  out.push("");

  const l = report.lockout;
  out.push(`5. Lockout after the profile's burst (${r.attempts} attempts):`);
  if (!l.burstSafe) out.push(`   the burst itself is unsafe (${corner(l.burst)}); no lockout makes it safe.`);
  else if (l.minimumLockoutS === null) out.push("   no lockout in the scanned range makes a second burst safe.");
  else if (l.minimumLockoutS <= setup.shortestWaitS && l.bands.length > 1)
    out.push(`   ${formatPlanDuration(l.minimumLockoutS)} (the shortest the relay allows) is safe (the next burst finds the bus still charged), but longer lockouts are not all safe: use one inside a band below; ${corner(l.governing)}.`);
  else if (l.minimumLockoutS <= setup.shortestWaitS) out.push(`   none needed: the same burst may start again as soon as the relay allows (${formatPlanDuration(l.minimumLockoutS)}); ${corner(l.governing)}.`);
  else out.push(`   at least ${formatPlanDuration(l.minimumLockoutS)} before the same burst may run again; ${corner(l.governing)}.`);
  if (l.bands.length > 1) out.push(`   Safe lockouts form separate bands: ${bands(l.bands)}.`);
  out.push(`   Back within ${l.ambientReturnK} K of ambient ${formatPlanDuration(l.ambientReturnS)} after the burst ends (slowest corner "${l.ambientReturnCorner}").`);
  out.push(`   The profile's lockout is ${formatPlanDuration(r.lockoutS)}.`);
  out.push("");

  out.push(`6. Lockout map: the worst corner's peak for bursts of 1 to ${report.map.attempts.length} attempts at ${report.map.intervalsS.length} intervals.`);
  out.push(lockoutMapHeatmap(report.map, width).trimEnd());
  out.push("");
  out.push(formatCautions(setup.linearMosfet, width).trimEnd());
  return `${fitToWidth(out.join("\n"), width)}\n`;
}

/**
 * Every line longer than `width` rewrapped under its own indentation (a list item's text under
 * its text), so that no sentence runs past the width; table and map rows are built within it
 * and pass unchanged. Cost O(length of text).
 */
function fitToWidth(text: string, width: number): string {
  return text
    .split("\n")
    .map((line) => {
      if (line.length <= width) return line;
      const lead = /^\s*(?:- )?/.exec(line)![0];
      return wrapped(lead, line.slice(lead.length), width);
    })
    .join("\n");
}
