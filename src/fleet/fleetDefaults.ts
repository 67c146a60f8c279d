/**
 * The defaults of `heatledger fleet`, declared once: the code, the command's help and
 * docs/fleet.md read them here. A light module (no imports), so the command definition can print
 * them in --help.
 */
export const FLEET_DEFAULTS = {
  /** rows of the text table (all rows go to --csv, --ndjson and --json) */
  tableRows: 40,
  /** units drawn in the report's ranked charts */
  chartUnits: 40,
  /**
   * fewest units per worker thread by default: a worker loads the library and warms up on its own
   * (about a CPU-second), so a small fleet stays in one thread
   */
  unitsPerWorker: 16,
  /** units a worker thread replays per task (the progress line moves once per task) */
  unitsPerTask: 4,
  /** file name endings read as logs when a folder is given */
  logExtensions: [".csv"],
} as const;
