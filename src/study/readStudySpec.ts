import { FieldReader, join } from "../format/FieldReader.js";
import { describeFound } from "../errors/InputError.js";

/** The study commands a spec file can run. */
export const STUDY_SPEC_COMMANDS = ["sweep", "sensitivity", "montecarlo", "compare"] as const;

/** One of {@link STUDY_SPEC_COMMANDS}. */
export type StudySpecCommand = (typeof STUDY_SPEC_COMMANDS)[number];

/** One quantity a spec varies, as the command's option text (`PATH=10 ohm..100 ohm:5:log`), with its field. */
export interface StudySpecItem {
  /** its field in the spec: `vary[1]`, `set[0]` */
  readonly field: string;
  /** the parameter path */
  readonly path: string;
  /** the value of the command's --vary or --set option */
  readonly option: string;
}

/** A study spec file, read: which command, on which profile, with what. */
export interface StudySpec {
  readonly command: StudySpecCommand;
  /** the profile, as the spec writes it (relative to the spec's folder) */
  readonly profile: string;
  /** compare: the second profile, as written */
  readonly against?: string;
  readonly answers?: readonly string[];
  readonly part?: string;
  readonly vary: readonly StudySpecItem[];
  readonly set: readonly StudySpecItem[];
  readonly samples?: number;
  readonly seed?: number;
  readonly workers?: number;
  readonly step?: number;
}

/** The keys of a spec, by the commands that take them (the first two every command takes). */
const KEYS: Readonly<Record<StudySpecCommand, readonly string[]>> = {
  sweep: ["study", "profile", "description", "answers", "part", "vary"],
  sensitivity: ["study", "profile", "description", "answers", "part", "vary", "step"],
  montecarlo: ["study", "profile", "description", "answers", "part", "vary", "samples", "seed", "workers"],
  compare: ["study", "profile", "description", "part", "against", "set"],
};

/** The keys of one `vary` item, by command. */
const VARY_KEYS: Readonly<Record<StudySpecCommand, readonly string[]>> = {
  sweep: ["path", "values", "from", "to", "points", "scale"],
  sensitivity: ["path"],
  montecarlo: ["path", "distribution"],
  compare: [],
};

/** A quantity as the spec writes it: a string, or a plain number (SI). */
function quantityText(reader: FieldReader, raw: unknown, field: string): string {
  if (typeof raw === "number" && Number.isFinite(raw)) return String(raw);
  if (typeof raw === "string" && raw.trim() !== "") return raw.trim();
  reader.fail("bad-option", field, 'a quantity such as "22 ohm"', describeFound(raw));
  return "";
}

/** A whole number from min up, or undefined when absent. */
function whole(reader: FieldReader, raw: unknown, field: string, min: number): number | undefined {
  if (raw === undefined) return undefined;
  if (typeof raw === "number" && Number.isInteger(raw) && raw >= min) return raw;
  reader.fail("bad-option", field, `a whole number ≥ ${min}`, describeFound(raw));
  return undefined;
}

/**
 * Read a study spec (docs/studies.md, "Study files"): `study` names the command (sweep,
 * sensitivity, montecarlo, compare), `profile` the duty profile, and the other keys are the
 * command's options in YAML form — `answers` a list of answer names, `vary` a list of
 * `{ path, ... }` items (sweep: `values` or `from`/`to`/`points`/`scale`; montecarlo:
 * `distribution`; sensitivity: the path alone), `set` a list of `{ path, value }` (compare),
 * `against` compare's second profile, `samples`, `seed`, `workers`, `step`. Each item becomes the
 * command's option text, so a spec means what the same command line means. Every problem of the
 * file is collected. Cost O(size of the spec).
 * @param data the spec's plain data (YAML or JSON)
 * @throws InputError `bad-option` naming each bad key (the caller adds file and line)
 */
export function readStudySpec(data: unknown): StudySpec {
  const reader = new FieldReader();
  const top = reader.record(data, "", ["study", "profile", "description", "answers", "part", "vary", "set", "against", "samples", "seed", "workers", "step"], ["study", "profile"]);
  reader.done();
  const spec = top!;
  const command = reader.choice(spec.study, "study", STUDY_SPEC_COMMANDS);
  reader.done();
  reader.record(spec, "", KEYS[command!]);
  const profile = reader.text(spec.profile, "profile", "a profile file name");
  const against = spec.against === undefined ? undefined : reader.text(spec.against, "against", "a profile file name");
  const answers = spec.answers === undefined ? undefined : reader.list(spec.answers, "answers", "answer names", 1)?.map((a, i) => reader.text(a, join("answers", i), "an answer name"));
  const part = spec.part === undefined ? undefined : reader.text(spec.part, "part", "a part id");
  const vary: StudySpecItem[] = [];
  if (spec.vary !== undefined) {
    const items = reader.list(spec.vary, "vary", "quantities to vary ({ path: ... })", 1) ?? [];
    items.forEach((raw, i) => {
      const field = join("vary", i);
      const item = reader.record(raw, field, VARY_KEYS[command!], command === "sensitivity" ? ["path"] : ["path"]);
      if (item === undefined) return;
      const path = reader.text(item.path, join(field, "path"), "a parameter path such as circuit.resistance");
      let option = path;
      if (command === "sweep") {
        if (item.values !== undefined) {
          const values = reader.list(item.values, join(field, "values"), "values", 1) ?? [];
          option = `${path}=${values.map((v, j) => quantityText(reader, v, join(join(field, "values"), j))).join(",")}`;
          if (item.from !== undefined || item.to !== undefined) reader.fail("bad-option", join(field, "from"), "either values or from/to/points, not both", "both");
        } else {
          const from = quantityText(reader, item.from, join(field, "from"));
          const to = quantityText(reader, item.to, join(field, "to"));
          const points = whole(reader, item.points, join(field, "points"), 2);
          if (item.points === undefined) reader.fail("bad-option", join(field, "points"), "a whole number ≥ 2 (with from and to)", "nothing");
          const scale = item.scale === undefined ? "linear" : reader.choice(item.scale, join(field, "scale"), ["linear", "log"] as const);
          option = `${path}=${from}..${to}:${points ?? 2}${scale === "log" ? ":log" : ""}`;
        }
      } else if (command === "montecarlo") {
        option = `${path}=${reader.text(item.distribution, join(field, "distribution"), 'a distribution such as "normal 5 %" or "tolerance 10 %"')}`;
      }
      vary.push({ field, path, option });
    });
  }
  const set: StudySpecItem[] = [];
  if (spec.set !== undefined) {
    (reader.list(spec.set, "set", "values to set ({ path, value })", 1) ?? []).forEach((raw, i) => {
      const field = join("set", i);
      const item = reader.record(raw, field, ["path", "value"], ["path", "value"]);
      if (item === undefined) return;
      const path = reader.text(item.path, join(field, "path"), "a parameter path such as circuit.resistance");
      set.push({ field, path, option: `${path}=${quantityText(reader, item.value, join(field, "value"))}` });
    });
  }
  if (command === "compare" && against === undefined && set.length === 0) reader.fail("bad-option", "against", "a second profile (against) or a list of values to set (set)", "neither");
  if ((command === "sweep" || command === "montecarlo") && vary.length === 0 && spec.vary === undefined) reader.fail("bad-option", "vary", "a list of quantities to vary", "nothing");
  const samples = whole(reader, spec.samples, "samples", 1);
  const seed = whole(reader, spec.seed, "seed", 0);
  const workers = whole(reader, spec.workers, "workers", 1);
  let step: number | undefined;
  if (spec.step !== undefined) {
    if (typeof spec.step === "number" && spec.step > 0 && spec.step < 0.5) step = spec.step;
    else reader.fail("bad-option", "step", "a relative step above 0 and below 0.5, such as 0.01", describeFound(spec.step));
  }
  reader.done();
  return {
    command: command!,
    profile,
    ...(against === undefined ? {} : { against }),
    ...(answers === undefined ? {} : { answers }),
    ...(part === undefined ? {} : { part }),
    vary,
    set,
    ...(samples === undefined ? {} : { samples }),
    ...(seed === undefined ? {} : { seed }),
    ...(workers === undefined ? {} : { workers }),
    ...(step === undefined ? {} : { step }),
  };
}
