import type { AttemptProtection } from "../circuits/AttemptProtection.js";

/**
 * Profile protection as a YAML fragment to paste under a profile's `circuit:` key (the keys of
 * docs/profile-format.md, "Protection inside an attempt"). Numbers are written in SI (s, V, A,
 * A²s) with every digit, so the profile that reads them back holds exactly these values.
 * Cost O(checks).
 */
export function protectionFragment(protection: AttemptProtection, title: string): string {
  const out = [`# ${title}`, "# paste under `circuit:` (numbers in SI: seconds, volts, amperes, A^2 s)", "protection:"];
  const n = (x: number): string => String(x);
  if (protection.busChecks !== undefined && protection.busChecks.length > 0) {
    out.push("  busChecks:");
    for (const b of protection.busChecks) {
      const fields = [`at: ${n(b.atS)}`, ...(b.minV === undefined ? [] : [`below: ${n(b.minV)}`]), ...(b.maxV === undefined ? [] : [`above: ${n(b.maxV)}`])];
      out.push(`    - { ${fields.join(", ")} }${b.minV !== undefined ? "   # early abort: bus too slow" : "   # bus too fast: a bypassed pre-charge element"}`);
    }
  }
  if (protection.riseChecks !== undefined && protection.riseChecks.length > 0) {
    out.push("  riseChecks:");
    for (const r of protection.riseChecks) out.push(`    - { from: ${n(r.fromS)}, to: ${n(r.toS)}, atLeast: ${n(r.minRateVPerS)} }`);
  }
  if (protection.overCurrent !== undefined) out.push(`  overCurrent: { above: ${n(protection.overCurrent.currentA)}, for: ${n(protection.overCurrent.delayS)} }`);
  for (const l of protection.i2t ?? []) out.push(l.kind === "fuse" ? `  fuse: { i2t: ${n(l.limitA2s)} }` : `  firmwareI2t: ${n(l.limitA2s)}`);
  if (protection.maxOnTimeS !== undefined) out.push(`  maxOnTime: ${n(protection.maxOnTimeS)}`);
  return `${out.join("\n")}\n`;
}
