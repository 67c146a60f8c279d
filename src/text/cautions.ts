/**
 * The cautions that close every human-readable report and travel with every JSON report (as
 * `cautions`, a list of strings; docs/design.md, "Cautions"), declared once.
 */
export const GENERAL_CAUTION =
  "Caution: these results are only as good as the thermal network, circuit values and duty profile supplied. " +
  "Margins must cover part tolerances, ageing and measurement error. The part maker's ratings, local codes and " +
  "licensed engineering practice govern the design; an overheated part can crack, burn or ignite nearby material.";

/** Added when a linear-mode MOSFET is among the parts. */
export const LINEAR_MOSFET_CAUTION =
  "Caution (linear-mode MOSFET): at high drain-source voltage a MOSFET can fail from thermal instability " +
  "(hot-spotting) well inside its thermal rating; check the maker's DC/linear-mode SOA, not only the temperature.";

/**
 * The cautions of a report, for the JSON key `cautions`: the general one, and the linear-mode MOSFET one when it applies.
 * @example
 * reportCautions(true).length // => 2
 */
export function reportCautions(includeLinearMosfet: boolean): string[] {
  return [GENERAL_CAUTION, ...(includeLinearMosfet ? [LINEAR_MOSFET_CAUTION] : [])];
}

/**
 * The closing block of a report, wrapped to a width.
 * @example
 * formatCautions(false, 60).split("\n")[0] // => "Caution: these results are only as good as the thermal"
 */
export function formatCautions(includeLinearMosfet: boolean, width = 100): string {
  return reportCautions(includeLinearMosfet).map((b) => wrapText(b, width)).join("\n") + "\n";
}

/** Units that must stay on the line of the number before them ("200.0 °C", not "200.0" / "°C"). */
const UNIT_WORDS = /^(?:°C|K|K\/W|J\/K|%|s|ms|µs|min|h|d|J|W|V|A|Ω|ohm|mF|µF|F)[).,;:]*$/;

/** Joins a unit to its number while wrapping; printed as a plain space. */
const GLUE = "\u0000";

/** Words with every unit word joined to the word before it (by GLUE). */
function glueUnits(words: readonly string[]): string[] {
  const out: string[] = [];
  for (const word of words) {
    if (out.length > 0 && UNIT_WORDS.test(word)) out[out.length - 1] = `${out[out.length - 1]}${GLUE}${word}`;
    else out.push(word);
  }
  return out;
}

/** Greedy word wrap to a width; a unit never starts a line ("200.0 °C" stays together). */
export function wrapText(text: string, width: number): string {
  const lines: string[] = [];
  let line = "";
  for (const word of glueUnits(text.split(/\s+/))) {
    if (line !== "" && line.length + 1 + word.length > width) {
      lines.push(line);
      line = word;
    } else line = line === "" ? word : `${line} ${word}`;
  }
  if (line !== "") lines.push(line);
  return lines.join("\n").replaceAll(GLUE, " ");
}
