import { readdirSync, statSync } from "node:fs";
import { basename, dirname, extname, isAbsolute, join } from "node:path";
import { InputError, describeFound } from "../errors/InputError.js";
import { lazyCsv } from "../format/lazyCsv.js";
import { FLEET_DEFAULTS } from "../fleet/fleetDefaults.js";
import type { CliIo } from "./CliIo.js";
import { readTextFile } from "./readInputFile.js";

/** One log of a fleet: the unit's id and the log's path. */
export interface FleetLogRef {
  readonly unit: string;
  readonly file: string;
}

const GLOB_CHARS = /[*?[]/;

/** Whether a path is a folder on the file system (false when missing or unreadable). */
function isFolder(path: string): boolean {
  try {
    return statSync(path).isDirectory();
  } catch {
    return false;
  }
}

/** A compare by UTF-16 code units (never by locale), so every machine lists a folder the same way. */
function byCodeUnits(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** The log files below a folder (FLEET_DEFAULTS.logExtensions, any case), in every subfolder, sorted; links to folders are not followed. */
function logsBelow(folder: string): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(folder, { withFileTypes: true }).sort((a, b) => byCodeUnits(a.name, b.name))) {
    if (entry.name.startsWith(".")) continue;
    const path = join(folder, entry.name);
    if (entry.isDirectory()) out.push(...logsBelow(path));
    else if ((FLEET_DEFAULTS.logExtensions as readonly string[]).includes(extname(entry.name).toLowerCase()) && (entry.isFile() || entry.isSymbolicLink())) out.push(path);
  }
  return out;
}

/** A glob segment as a regular expression: `*` any run of characters but `/`, `?` one, `[...]` a class (`[!...]` negated). */
function segmentPattern(segment: string): RegExp {
  let source = "";
  for (let i = 0; i < segment.length; i++) {
    const c = segment[i]!;
    if (c === "*") source += "[^/]*";
    else if (c === "?") source += "[^/]";
    else if (c === "[") {
      const end = segment.indexOf("]", i + 2);
      if (end < 0) source += "\\[";
      else {
        const body = segment.slice(i + 1, end).replace(/\\/g, "\\\\");
        source += `[${body.startsWith("!") ? `^${body.slice(1)}` : body}]`;
        i = end;
      }
    } else source += c.replace(/[.+^${}()|\\\]]/g, "\\$&");
  }
  return new RegExp(`^${source}$`);
}

/**
 * The files a glob pattern matches (`*`, `?`, `[...]` within a path segment, `**` for any
 * number of folders), sorted; names starting with a dot match only a segment that starts with one.
 * Cost O(entries of the folders the pattern walks).
 */
export function expandLogGlob(pattern: string): string[] {
  const segments = pattern.split("/");
  let start = 0;
  while (start < segments.length - 1 && !GLOB_CHARS.test(segments[start]!)) start++;
  const base = segments.slice(0, start).join("/") || (isAbsolute(pattern) ? "/" : ".");
  const rest = segments.slice(start);
  const found: string[] = [];
  const walk = (folder: string, i: number, shown: string): void => {
    const segment = rest[i]!;
    const last = i === rest.length - 1;
    let entries;
    try {
      entries = readdirSync(folder, { withFileTypes: true }).sort((a, b) => byCodeUnits(a.name, b.name));
    } catch {
      return;
    }
    if (segment === "**") {
      if (!last) walk(folder, i + 1, shown);
      for (const e of entries) if (e.isDirectory() && !e.name.startsWith(".")) walk(join(folder, e.name), i, shown === "" ? e.name : `${shown}/${e.name}`);
      return;
    }
    const re = segmentPattern(segment);
    for (const e of entries) {
      if (e.name.startsWith(".") && !segment.startsWith(".")) continue;
      if (!re.test(e.name)) continue;
      const path = shown === "" ? e.name : `${shown}/${e.name}`;
      if (last) {
        if (!e.isDirectory()) found.push(path);
      } else if (e.isDirectory()) walk(join(folder, e.name), i + 1, path);
    }
  };
  const prefix = segments.slice(0, start).join("/");
  walk(base, 0, prefix);
  return [...new Set(found)].sort(byCodeUnits);
}

/** The unit id of a log named by its path: the file name without its extension. */
export function unitFromFile(file: string): string {
  return basename(file, extname(file));
}

/**
 * The logs of a list file: one log per line, `PATH` or `PATH,UNIT` (CSV, so a path holding a comma
 * is quoted); `#` starts a comment; an optional first line `log,unit` names the columns. A
 * relative path is read from the list file's folder.
 * @throws InputError naming the list file and line for a line with more than two cells or an empty path
 */
export function readLogList(io: CliIo, list: string): FleetLogRef[] {
  const text = readTextFile(io, list, "list of event logs");
  let rows: { record: string[]; info: { lines: number } }[];
  try {
    rows = lazyCsv.parse(text, { info: true, comment: "#", skip_empty_lines: true, trim: true, relax_column_count: true }) as unknown as typeof rows;
  } catch (error) {
    const e = error as { lines?: number; message?: string };
    throw new InputError({ code: "bad-file", file: list, line: e.lines ?? 0, field: "", expected: "one log per line: PATH or PATH,UNIT", found: describeFound(String(e.message ?? error)) });
  }
  if (rows[0] !== undefined && rows[0].record[0]?.toLowerCase() === "log" && (rows[0].record[1] === undefined || rows[0].record[1].toLowerCase() === "unit")) rows = rows.slice(1);
  return rows.map(({ record, info }) => {
    const [path = "", unit] = record;
    if (record.length > 2 || path === "" || unit === "")
      throw new InputError({ code: "bad-file", file: list, line: info.lines, field: "", expected: "PATH or PATH,UNIT (a log's path and, optionally, its unit id)", found: describeFound(record.join(",")) });
    const file = isAbsolute(path) || dirname(list) === "." ? path : join(dirname(list), path);
    return { unit: unit ?? unitFromFile(file), file };
  });
}

/**
 * The logs of a fleet run, in the order given: each argument a log file, a folder (its logs in
 * every subfolder, FLEET_DEFAULTS.logExtensions, in name order) or a glob pattern the shell did
 * not expand (`"logs/**\/unit-*.csv"`), then each list file (readLogList). The unit id is the
 * list file's second column, else the file name without its extension. A log named that does not
 * exist is kept: its read fails in the run and the unit is reported broken.
 * @throws InputError for no logs at all, a glob that matches nothing, a folder with no log, a bad
 *   list file, or one unit id given twice (naming both logs)
 */
export function collectFleetLogs(io: CliIo, args: readonly string[], lists: readonly string[]): FleetLogRef[] {
  const logs: FleetLogRef[] = [];
  const none = (arg: string, what: string): InputError =>
    new InputError({ code: "bad-option", file: arg, line: 0, field: "logs", expected: `event logs (${FLEET_DEFAULTS.logExtensions.join(", ")} files)`, found: what });
  for (const arg of args) {
    if (isFolder(arg)) {
      const found = logsBelow(arg);
      if (found.length === 0) throw none(arg, "a folder with no log in it");
      logs.push(...found.map((file) => ({ unit: unitFromFile(file), file })));
    } else if (GLOB_CHARS.test(arg) && !io.exists(arg)) {
      const found = expandLogGlob(arg);
      if (found.length === 0) throw none(arg, "a pattern that matches no file");
      logs.push(...found.map((file) => ({ unit: unitFromFile(file), file })));
    } else logs.push({ unit: unitFromFile(arg), file: arg });
  }
  for (const list of lists) logs.push(...readLogList(io, list));
  if (logs.length === 0) throw none("", "none (name log files, folders, patterns or --list FILE)");
  const seen = new Map<string, string>();
  for (const log of logs) {
    const first = seen.get(log.unit);
    if (first !== undefined)
      throw new InputError({
        code: "bad-option",
        file: log.file,
        line: 0,
        field: "unit",
        expected: `one log per unit (unit "${log.unit}" is already ${first}; give units their own ids in a --list file: PATH,UNIT)`,
        found: `unit "${log.unit}" again`,
      });
    seen.set(log.unit, log.file);
  }
  return logs;
}
