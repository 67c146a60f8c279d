import type { DutyProfile } from "../profile/DutyProfile.js";
import type { EventDigest } from "../profile/EventDigest.js";
import type { ProfileStressResult } from "../profile/ProfileStress.js";
import type { SimulationResult } from "../profile/simulateProfile.js";
import type { ChartTrace } from "../report/ChartTrace.js";
import { simulationCharts } from "../report/simulationCharts.js";
import { simulationVerdict } from "../report/simulationVerdict.js";
import { reportCautions } from "../text/cautions.js";
import type { CliIo } from "./CliIo.js";
import { type ChartFileFlags, writeChartReport } from "./writeChartReport.js";

/** What simulate and replay hand to their --report / --svg files. */
export interface SimulationReportInput {
  readonly command: string;
  readonly profile: DutyProfile;
  readonly result: SimulationResult;
  readonly digest: EventDigest;
  readonly trace: ChartTrace;
  readonly stress: ProfileStressResult;
  /** the text report (at 100 columns, without terminal charts) */
  readonly text: string;
}

/**
 * Write the --report page and the --svg chart of a simulated history (simulate, replay): the
 * verdict (simulationVerdict, as the text report's), the cautions, simulationCharts and the text
 * report. Loaded only when one of the two flags is given. Returns the lines saying what was written.
 * @throws InputError when an output file exists and --force is not set
 */
export async function writeSimulationReport(io: CliIo, flags: ChartFileFlags, input: SimulationReportInput): Promise<string> {
  const { profile, result } = input;
  const verdict = simulationVerdict(result.verdict, input.stress.ratingStatus);
  const charts = simulationCharts({ profile, result, events: input.digest.all, trace: input.trace, stress: input.stress });
  return writeChartReport(
    io,
    flags,
    {
      title: `heatledger ${input.command}: ${profile.name}`,
      verdict: verdict.verdict,
      verdictText: verdict.reason,
      cautions: reportCautions(profile.circuit?.topology === "linear-mosfet"),
      text: input.text,
    },
    charts,
  );
}
