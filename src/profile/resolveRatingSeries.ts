import { InputError, describeFound, inputError, withLocation } from "../errors/InputError.js";
import { parseStructuredText } from "../format/parseStructuredText.js";
import { resolveStressConfig } from "../stress/resolveStressConfig.js";
import type { PartInput } from "./profileSchema.js";
import type { ReadNamedFile } from "./ReadNamedFile.js";
import { whyUnreadable } from "./resolveProfilePart.js";

/** A family file as read: a list of series, each with an id and the rating keys of a part. */
interface FamilyFile {
  readonly series?: readonly { readonly id?: unknown; readonly ratings?: Record<string, unknown> }[];
}

/**
 * A part whose `ratings.series` names a series of a resistor family file (`{ file, id }`) gets
 * that series' rating keys, with the part's own rating keys over them (the part gives its
 * `resistance`, and may override any key); the `series` key itself is dropped. The family file
 * is read through the profile's reader, relative to the profile's folder; the series' keys are
 * checked there first (every value and table, with the series' first resistance standing in for
 * the part's, so its errors name the family file and its line). A part without `series` comes
 * back as it was. Source: wiring of our own (docs/stress.md, "Resistor families").
 * Cost O(family file).
 * @throws InputError `bad-file` for an unreadable file or an unknown id, and the family file's
 *   own problems, located in it
 */
export function resolveRatingSeries(part: PartInput, field: string, readFile: ReadNamedFile | undefined): PartInput {
  const ref = part.ratings?.series;
  if (ref === undefined) return part;
  const at = `${field}.ratings.series.file`;
  if (readFile === undefined) throw inputError("bad-file", at, "inline rating keys (this caller cannot read files)", describeFound(ref.file));
  let text: string;
  try {
    text = readFile(ref.file);
  } catch (error) {
    throw inputError("bad-file", at, "a readable resistor family file", `${describeFound(ref.file)} (${whyUnreadable(error, readFile.displayName?.(ref.file))})`);
  }
  const shown = readFile.displayName?.(ref.file) ?? ref.file;
  const doc = parseStructuredText(text, shown);
  const list = (doc.data as FamilyFile | null)?.series;
  if (!Array.isArray(list)) throw withLocation(inputError("bad-file", "series", "a list of series, each { id, ratings }", describeFound(list)), shown, "", doc.lineOf);
  const k = list.findIndex((s) => s?.id === ref.id);
  if (k < 0)
    throw inputError("bad-file", `${field}.ratings.series.id`, `the id of a series in ${shown}: ${list.map((s) => describeFound(s?.id)).join(", ")}`, describeFound(ref.id));
  const ratings = list[k]!.ratings ?? {};
  try {
    // the series is checked on its own: its first resistance stands in for the part's value
    const rows = (ratings.energyPerOhm as { rows?: { resistance?: unknown }[] } | undefined)?.rows;
    const standIn = rows?.[0]?.resistance === undefined ? {} : { resistance: rows[0].resistance };
    resolveStressConfig({ ratings: { ...ratings, ...standIn } }, { field: `series[${k}]` });
  } catch (error) {
    if (error instanceof InputError) throw withLocation(error, shown, "", doc.lineOf);
    throw error;
  }
  const { series: _series, ...own } = part.ratings!;
  return { ...part, ratings: { ...(ratings as NonNullable<PartInput["ratings"]>), ...own } };
}
