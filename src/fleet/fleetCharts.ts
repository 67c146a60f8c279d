import { REPORT_CHART_SIZE, type ReportChart, quantitativeField } from "../report/ReportChart.js";
import type { FleetReplayedRow } from "./FleetUnitRow.js";
import { greatestDamage, leastMarginK } from "./compareFleetRows.js";
import { FLEET_DEFAULTS } from "./fleetDefaults.js";
import type { FleetSummary } from "./fleetSummary.js";

/** The verdict colours of the fleet charts (those of the report page's verdict box). */
const VERDICT_SCALE = { domain: ["fail", "warn", "pass"], range: ["#b00020", "#a86400", "#1b7a2e"] } as const;

/**
 * The charts of a fleet report: the units most at risk (the first `chartUnits` of the ranking)
 * as horizontal bars of their least margin to a limit [K] (negative: above the limit), coloured by
 * verdict, in rank order from the top; and, for the units with a lifetime model and some damage,
 * their damage to date on a log scale, with the end of cycling life (1) marked.
 * Source: the fleet's own rows.
 * Cost O(chartUnits × parts).
 */
export function fleetCharts(summary: FleetSummary, chartUnits: number = FLEET_DEFAULTS.chartUnits): ReportChart[] {
  const ranked = summary.rows.filter((r): r is FleetReplayedRow => r.error === null).slice(0, chartUnits);
  if (ranked.length === 0) return [];
  const height = Math.max(REPORT_CHART_SIZE.height, 16 * ranked.length);
  const order = ranked.map((r) => r.unit);
  const colour = { field: "verdict", type: "nominal", title: "verdict", scale: VERDICT_SCALE };
  const y = { field: "unit", type: "nominal", title: "unit (most at risk on top)", sort: order };
  const charts: ReportChart[] = [
    {
      id: "fleet-margin",
      title: `Least margin to a limit, the ${ranked.length} units most at risk`,
      note: "Each unit's part closest to its limit: its limit less its peak [K]. Bars left of zero went above the limit during the log; the ranking puts fail, warn, pass in that order, then least margin.",
      spec: {
        $schema: "https://vega.github.io/schema/vega-lite/v6.json",
        width: REPORT_CHART_SIZE.width,
        height,
        data: { values: ranked.map((r, i) => ({ rank: i + 1, unit: r.unit, verdict: r.verdict, marginK: leastMarginK(r) })) },
        mark: { type: "bar" },
        encoding: { y, x: quantitativeField("marginK", "least margin to a limit [K]"), color: colour, tooltip: [{ field: "unit" }, { field: "marginK", type: "quantitative" }] },
      },
    },
  ];
  const damaged = ranked.filter((r) => greatestDamage(r) > 0);
  if (damaged.length > 0)
    charts.push({
      id: "fleet-damage",
      title: "Damage to date of the same units",
      note: "Miner damage of the whole log, greatest over the parts, on a log scale; 1 (the dashed rule) is the end of cycling life under the lifetime model. Units without damage or without a lifetime model are left out.",
      spec: {
        $schema: "https://vega.github.io/schema/vega-lite/v6.json",
        width: REPORT_CHART_SIZE.width,
        height: Math.max(REPORT_CHART_SIZE.height, 16 * damaged.length),
        layer: [
          {
            data: { values: damaged.map((r) => ({ unit: r.unit, verdict: r.verdict, damage: greatestDamage(r) })) },
            mark: { type: "point", filled: true, size: 60 },
            encoding: { y: { ...y, sort: damaged.map((r) => r.unit) }, x: quantitativeField("damage", "damage to date (Miner)", { scale: { type: "log" } }), color: colour },
          },
          { data: { values: [{ end: 1 }] }, mark: { type: "rule", color: "#c00000", strokeDash: [6, 3] }, encoding: { x: quantitativeField("end") } },
        ],
      },
    });
  return charts;
}
