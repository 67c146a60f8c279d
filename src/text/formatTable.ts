/** A column of a text table: its heading (with unit) and alignment. */
export interface TableColumn {
  readonly heading: string;
  readonly align?: "left" | "right";
}

/**
 * An aligned plain-text table: heading row, a rule, then the rows. Numbers should already be
 * formatted (with units in the heading); cells are padded to the widest entry of their column.
 * Cost O(rows × columns).
 * @example
 * formatTable([{ heading: "part" }, { heading: "peak [°C]", align: "right" }], [["R1", "98.2"]])
 */
export function formatTable(columns: readonly TableColumn[], rows: readonly (readonly string[])[]): string {
  const widths = columns.map((c, j) => Math.max(c.heading.length, ...rows.map((r) => (r[j] ?? "").length)));
  const cell = (text: string, j: number): string => ((columns[j]?.align ?? "left") === "right" ? text.padStart(widths[j]!) : text.padEnd(widths[j]!));
  const line = (cells: readonly string[]): string => columns.map((_, j) => cell(cells[j] ?? "", j)).join("  ").trimEnd();
  return [line(columns.map((c) => c.heading)), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)].join("\n") + "\n";
}

/**
 * A number with a fixed count of significant digits, without exponent for everyday magnitudes,
 * and never "NaN": non-finite values print as "n/a".
 */
export function formatNumber(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return "n/a";
  if (value === 0) return "0";
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-3 && magnitude < 1e7) {
    const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(magnitude)));
    return value.toFixed(Math.min(decimals, 12));
  }
  return value.toExponential(digits - 1);
}

/** A duration with a readable unit: 350 µs, 12.5 ms, 4.2 s, 3.1 min, 2.0 h, 5.4 d, 3.2 yr. */
export function formatDuration(seconds: number): string {
  if (!Number.isFinite(seconds)) return "n/a";
  const magnitude = Math.abs(seconds);
  if (magnitude === 0) return "0 s";
  if (magnitude < 1e-3) return `${formatNumber(seconds * 1e6, 3)} µs`;
  if (magnitude < 1) return `${formatNumber(seconds * 1e3, 3)} ms`;
  if (magnitude < 120) return `${formatNumber(seconds, 3)} s`;
  if (magnitude < 7200) return `${formatNumber(seconds / 60, 3)} min`;
  if (magnitude < 2 * 86400) return `${formatNumber(seconds / 3600, 3)} h`;
  if (magnitude < 365.25 * 86400) return `${formatNumber(seconds / 86400, 3)} d`;
  return `${formatNumber(seconds / (365.25 * 86400), 3)} yr`;
}
