import { TIME_SERIES_DEFAULTS } from "../../report/timeSeriesDefaults.js";

/** --report FILE.html, shared by simulate, replay, retries, supervise and size. */
export const REPORT_OPTION = {
  flags: "--report <file.html>",
  help: "write one self-contained HTML page (verdict, cautions, charts as inline SVG, no script, nothing fetched) for a design review",
} as const;

/** --svg FILE, the main chart alone. */
export const SVG_OPTION = { flags: "--svg <file.svg>", help: "write the report's main chart alone as an SVG file" } as const;

/** --sample-step, shared by the commands that simulate a history (simulate, replay). */
export const SAMPLE_STEP_OPTION = {
  flags: "--sample-step <s>",
  help: "for --csv and --report, also sample the history at every multiple of this time (e.g. 1 s, 10 ms; exact values)",
} as const;

/** --sample-ratio, as SAMPLE_STEP_OPTION. */
export const SAMPLE_RATIO_OPTION = {
  flags: "--sample-ratio <r>",
  help:
    "for --csv and --report, exact samples inside every step from a quarter of the fastest time constant on, each r times later " +
    `than the last, plus ${TIME_SERIES_DEFAULTS.sampleDivisions - 1} evenly spaced, so cooling reads as a curve (default ${TIME_SERIES_DEFAULTS.sampleRatio}: one per octave; 0: step ends and peaks only)`,
} as const;

/** --force for the commands whose only output files are the chart files (supervise, size). */
export const CHART_FORCE_OPTION = { flags: "--force", help: "overwrite the --report or --svg file if it exists" } as const;
