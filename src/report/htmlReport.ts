import { VERDICTS, type Verdict } from "../stress/Verdict.js";

/** A rendered chart for the page: its title, note and SVG text. */
export interface HtmlChart {
  readonly title: string;
  readonly note: string;
  readonly svg: string;
}

/** What a report page holds, in page order after the title. */
export interface HtmlReportInput {
  /** "heatledger simulate: <profile name>" */
  readonly title: string;
  readonly verdict: Verdict;
  /** why, in words ("": the verdict's general meaning, VERDICTS) */
  readonly verdictText: string;
  /** the cautions, one paragraph each */
  readonly cautions: readonly string[];
  readonly charts: readonly HtmlChart[];
  /** the command's whole text report, shown last as preformatted text */
  readonly text: string;
}

/** Escape text for HTML element content and attribute values. */
export function escapeHtml(text: string): string {
  return text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
}

const VERDICT_COLOURS: Readonly<Record<Verdict, string>> = { pass: "#1b7a2e", warn: "#a86400", fail: "#b00020" };

/**
 * One self-contained HTML page for a design review: the verdict and the cautions first, then
 * every chart as inline SVG (each with its title and a note on how to read it), then the
 * command's full text report. No script, no external font, style sheet or image: the page opens
 * from a file with no network and prints as shown.
 * Source: HTML Living Standard (WHATWG) document structure; inline SVG per SVG 1.1.
 * Cost O(size of the charts and the text).
 */
export function htmlReport(input: HtmlReportInput): string {
  const colour = VERDICT_COLOURS[input.verdict];
  const charts = input.charts
    .map((c) => `<section class="chart">\n<h2>${escapeHtml(c.title)}</h2>\n<p class="note">${escapeHtml(c.note)}</p>\n${c.svg}\n</section>`)
    .join("\n");
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(input.title)}</title>
<style>
body { font-family: sans-serif; margin: 1.5em auto; max-width: 60em; padding: 0 1em; color: #222; }
h1 { font-size: 1.4em; } h2 { font-size: 1.1em; margin-top: 1.6em; }
.verdict { border-left: 0.5em solid ${colour}; padding: 0.4em 0.8em; background: #f6f6f6; }
.verdict strong { color: ${colour}; text-transform: uppercase; }
.cautions p { font-size: 0.92em; margin: 0.4em 0; }
.note { font-size: 0.9em; color: #555; margin: 0.2em 0 0.5em; }
.chart svg { max-width: 100%; height: auto; }
pre { font-size: 0.8em; background: #f8f8f8; padding: 0.8em; overflow-x: auto; }
</style>
</head>
<body>
<h1>${escapeHtml(input.title)}</h1>
<div class="verdict"><strong>${input.verdict}</strong> ${escapeHtml(input.verdictText === "" ? VERDICTS[input.verdict].meaning : input.verdictText)}</div>
<div class="cautions">
${input.cautions.map((c) => `<p>${escapeHtml(c)}</p>`).join("\n")}
</div>
${charts}
<h2>Text report</h2>
<pre>${escapeHtml(input.text)}</pre>
</body>
</html>
`;
}
