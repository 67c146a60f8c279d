import { wrapText } from "../../text/cautions.js";
import { VERDICT_ORDER, VERDICTS } from "../../stress/Verdict.js";
import { EXIT_INPUT } from "../CliIo.js";

/** The flag every judging command takes (simulate, replay, retries, supervise, size). */
export const STRICT_OPTION = { flags: "--strict", help: "exit with status 1 on a warn verdict too (for CI gating)" } as const;

/** Help width of the paragraph's text (commander's own lines stay within it too). */
const HELP_WIDTH = 96;

/** "  term   text", the text wrapped under itself. */
function definition(term: string, text: string): string {
  const indent = 9;
  return wrapText(text, HELP_WIDTH - indent)
    .split("\n")
    .map((line, i) => (i === 0 ? `  ${term.padEnd(indent - 2)}${line}` : `${" ".repeat(indent)}${line}`))
    .join("\n");
}

/**
 * The "Verdict and exit status" paragraph of a command's --help, built from VERDICTS (the one
 * rule) and EXIT_INPUT, followed by what the verdict covers in this command.
 * @param covers one or two sentences: what this command's verdict judges
 */
export function verdictHelp(covers: string): string {
  const words = VERDICT_ORDER.map((v) => {
    const rule = VERDICTS[v];
    const status = rule.strictExitStatus === rule.exitStatus ? `exit status ${rule.exitStatus}` : `exit status ${rule.exitStatus}, or ${rule.strictExitStatus} with --strict`;
    return definition(v, `${rule.meaning}: ${status}`);
  });
  return [
    "Verdict and exit status (one rule for every command that judges a part; the same words in",
    'the report and in the JSON "verdict"):',
    ...words,
    `  bad input (a file, field or flag): exit status ${EXIT_INPUT}`,
    wrapText(covers, HELP_WIDTH),
  ].join("\n");
}
