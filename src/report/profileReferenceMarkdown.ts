import { type ProfileKeyRow, profileKeyRows } from "../profile/profileKeyRows.js";
import { type ProfileKeyNote, PROFILE_KEY_NOTES } from "./profileKeyNotes.js";

/** The command that rewrites docs/profile-reference.md, printed in the page and in test failures. */
export const PROFILE_REFERENCE_COMMAND = "npm run docs:profile";

/** The note of a row: by its exact path, else with each `[variant]` replaced by `[*]`. */
export function profileKeyNote(path: string, notes: Readonly<Record<string, ProfileKeyNote>> = PROFILE_KEY_NOTES): ProfileKeyNote | undefined {
  return notes[path] ?? notes[path.replace(/\[[a-z0-9-]+\]/g, "[*]")];
}

const cell = (text: string): string => text.replace(/\|/g, "\\|").replace(/\n/g, " ");
const code = (text: string): string => (text === "" ? "" : `\`${text}\``);

/** The example of a row: its note's, else the one the schema's error words carry, else an enum's first choice. */
export function profileKeyExample(row: ProfileKeyRow, note: ProfileKeyNote | undefined): string {
  if (note?.example !== undefined) return note.example;
  if (row.schemaExample !== undefined) return row.schemaExample;
  const choice = /^one of: ([^,;]+)/.exec(row.type);
  return choice === null ? "" : choice[1]!;
}

/**
 * The profile reference page (docs/profile-reference.md): every key of the duty-profile schema,
 * one table per top-level section, with its type, unit, default, meaning and an example. Rows
 * come from the schema itself (`profileKeyRows`), words from {@link PROFILE_KEY_NOTES}; a key
 * without a note shows "(no note yet)" and the reference's test fails on it. Pure; never throws.
 */
export function profileReferenceMarkdown(rows: readonly ProfileKeyRow[] = profileKeyRows()): string {
  const out: string[] = [
    "# heatledger — profile reference",
    "",
    "Every key of a duty profile: its type, the unit a plain number is read in, its default, what it",
    "does and a value to copy. Quantities are a plain number in the unit shown or text with any unit",
    '(`"4.7 mF"`, `"350 ms"`, `"40 degC"`); temperature differences are in K. `[]` marks a list item;',
    "`[lesit]` a variant chosen by `model`. The format's rules (what each event does, how attempts",
    "chain) are in docs/profile-format.md; `heatledger init` writes a starting profile.",
    "",
    `This page is generated from the profile's schema (src/profile/profileSchema.ts) and the notes in`,
    `src/report/profileKeyNotes.ts by \`${PROFILE_REFERENCE_COMMAND}\`; a test fails when they disagree.`,
  ];
  const groups = new Map<string, ProfileKeyRow[]>();
  for (const row of rows) {
    const top = /^[^.[]+/.exec(row.path)![0];
    const group = rows.some((r) => r.path.startsWith(`${top}.`) || r.path.startsWith(`${top}[]`)) ? top : "";
    groups.set(group, [...(groups.get(group) ?? []), row]);
  }
  for (const [group, groupRows] of groups) {
    out.push("", `## ${group === "" ? "Top level" : `\`${group}\``}`, "", "| Key | Type | Unit | Default | Meaning | Example |", "|---|---|---|---|---|---|");
    for (const row of groupRows) {
      const note = profileKeyNote(row.path);
      const unit = note?.unit ?? row.unit;
      const fallback = row.required ? "**required**" : "optional";
      const defaultText = row.required ? fallback : (note?.default ?? fallback);
      out.push(
        `| ${[code(row.path), row.type, code(unit), defaultText, note?.meaning ?? "(no note yet)", code(profileKeyExample(row, note))].map(cell).join(" | ")} |`,
      );
    }
  }
  return `${out.join("\n")}\n`;
}
