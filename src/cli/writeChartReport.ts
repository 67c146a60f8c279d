import { type HtmlReportInput, htmlReport } from "../report/htmlReport.js";
import type { ReportChart } from "../report/ReportChart.js";
import { renderChartSvg } from "../report/renderChartSvg.js";
import type { CliIo } from "./CliIo.js";
import { writeOutputFile } from "./readInputFile.js";

/** The output flags of the chart files. */
export interface ChartFileFlags {
  /** --report FILE.html: the whole page */
  readonly report?: string;
  /** --svg FILE: the first (main) chart alone */
  readonly svg?: string;
  readonly force?: boolean;
}

/**
 * Render a command's charts to SVG (vega, loaded with this module: only runs that ask for
 * --report or --svg load it) and write the --report page (htmlReport) and the --svg file (the
 * first chart) through writeOutputFile. Returns the report's lines saying what was written ("" when
 * neither flag is given).
 * @throws InputError when an output file exists and --force is not set
 */
export async function writeChartReport(io: CliIo, flags: ChartFileFlags, page: Omit<HtmlReportInput, "charts">, charts: readonly ReportChart[]): Promise<string> {
  if (flags.report === undefined && flags.svg === undefined) return "";
  const force = flags.force === true;
  let note = "";
  if (flags.svg !== undefined && charts.length > 0) {
    writeOutputFile(io, flags.svg, `${await renderChartSvg(charts[0]!)}\n`, force, "--svg");
    note += `Chart: ${charts[0]!.title} written to ${flags.svg}\n`;
  }
  if (flags.report !== undefined) {
    const rendered = [];
    for (const chart of charts) rendered.push({ title: chart.title, note: chart.note, svg: await renderChartSvg(chart) });
    writeOutputFile(io, flags.report, htmlReport({ ...page, charts: rendered }), force, "--report");
    note += `Report: ${rendered.length} charts written to ${flags.report}\n`;
  }
  return note;
}
