import { type Document, isMap, isScalar, isSeq, parseDocument } from "yaml";
import { InputError, describeFound, inputError } from "../errors/InputError.js";
import { nearestKey } from "../errors/nearestKey.js";
import type { DutyProfile } from "../profile/DutyProfile.js";
import type { ReadNamedFile } from "../profile/ReadNamedFile.js";
import { loadProfile } from "../profile/loadProfile.js";
import { DIMENSIONS, type Dimension, expectedWords } from "../units/dimensions.js";
import { parseQuantity } from "../units/parseQuantity.js";

/** One step of a parameter path: a key of a mapping or an index of a list. */
type Step = string | number;

/** A quantity of a profile (or of a network file it names) that a study varies. */
export interface StudyParameter {
  /** the path in canonical form: list items by index, `parts[0].network.stages[1].r` */
  readonly path: string;
  /** "" for the profile itself, else the network file name as the profile writes it */
  readonly file: string;
  /** the steps inside that document */
  readonly steps: readonly Step[];
  /** the dimension the loader expects there (found by asking the loader itself) */
  readonly dimension: Dimension;
  /** the value the profile gives, in SI (°C for absolute temperatures); undefined when the key is not written */
  readonly nominal: number | undefined;
  /** the value as the file writes it ("3.3 mF"), or "(not written)" */
  readonly written: string;
}

/** A value for a parameter, in SI (°C for absolute temperatures). */
export type StudyAssignment = readonly [StudyParameter, number];

/** A marker no quantity parser accepts: the loader's complaint about it names the field's dimension. */
const PROBE_VALUE = "study-probe";

/** "circuit.resistance" or "parts[0].network.stages[1].r" into steps; part ids stay strings. */
function splitPath(text: string): Step[] {
  const steps: Step[] = [];
  for (const piece of text.trim().split(".")) {
    const match = /^([^[\]]*)((?:\[\d+\])*)$/.exec(piece);
    if (match === null || (match[1] === "" && match[2] === "")) return [];
    if (match[1] !== "") steps.push(match[1]!);
    for (const index of match[2]!.matchAll(/\[(\d+)\]/g)) steps.push(Number(index[1]));
  }
  return steps;
}

/** Steps back into a path: `a.b[2].c`. */
function joinSteps(steps: readonly Step[]): string {
  return steps.map((s, i) => (typeof s === "number" ? `[${s}]` : i === 0 ? s : `.${s}`)).join("");
}

/**
 * A duty profile held as YAML document text, so that a study can set any of its quantities and
 * load the edited profile through `loadProfile`, the very path `simulate`, `retries`,
 * `supervise` and `size` take: every study answer is what those commands print on the edited
 * file. The YAML Document API edits the value in place and keeps the file's own form (comments,
 * flow maps, key order).
 *
 * Parameter paths (syntax of our own, docs/studies.md): keys joined by dots, list items by
 * `[index]`, and a part also by its id (`parts.precharge-resistor.limits.margin` is
 * `parts[0].limits.margin`). A path that passes a `network:` naming a file goes on inside that
 * file (`parts[0].network.stages[1].r` edits stage 1 of the named network file); the edit is held
 * in memory and every part naming the same file sees it, as they share the network.
 * The dimension of a parameter is the one the loader itself asks for there, so the paths follow
 * the profile format with no list of keys of their own.
 * Cost per load: one YAML print and parse of the edited documents plus loadProfile.
 */
export class StudyProfile {
  readonly file: string;
  /** the profile's text as read */
  readonly text: string;
  private readonly document: Document;
  private readonly networks = new Map<string, Document>();
  private readonly readCache = new Map<string, string>();
  private readonly readNamed: ReadNamedFile | undefined;
  /** the files the profile names, read once, by name as written */
  readonly namedFiles: ReadonlyMap<string, string> = this.readCache;
  /** the profile as written, loaded */
  readonly nominal: DutyProfile;

  /**
   * @param text the profile's YAML or JSON text
   * @param file its name, for messages
   * @param readNamed reads a file the profile names (network, power trace)
   * @throws InputError for a bad profile (as loadProfile)
   */
  constructor(text: string, file: string, readNamed?: ReadNamedFile) {
    this.file = file;
    this.text = text;
    this.readNamed = readNamed;
    this.nominal = loadProfile(text, file, this.reader(new Map()));
    this.document = parseDocument(text);
  }

  /**
   * Resolve a parameter path against the profile.
   * @param text the path as the user wrote it
   * @param option the option it came from, for messages (`--vary`)
   * @throws InputError `bad-option` for a path that addresses nothing (with the nearest valid
   *   path), a value that is not a quantity, or a key the profile format does not have
   */
  parameter(text: string, option: string): StudyParameter {
    const steps = splitPath(text);
    if (steps.length === 0) throw inputError("bad-option", option, 'a parameter path such as "circuit.resistance"', describeFound(text));
    let document = this.document;
    let file = "";
    let node: unknown = document.contents;
    const canonical: Step[] = [];
    let local: Step[] = [];
    for (let i = 0; i < steps.length; i++) {
      let step = steps[i]!;
      const last = i === steps.length - 1;
      if (isSeq(node) && typeof step === "string" && canonical[canonical.length - 1] === "parts" && file === "") {
        const ids = node.items.map((item) => (isMap(item) ? String(item.get("id")) : ""));
        const index = ids.indexOf(step);
        if (index < 0) throw this.unknown(text, option, [...canonical, step], nearestKey(step, ids), canonical, steps.slice(i + 1));
        step = index;
      }
      if (isMap(node)) {
        const keys = node.items.map((p) => (isScalar(p.key) ? String(p.key.value) : ""));
        if (typeof step !== "string" || !keys.includes(step)) {
          if (last && typeof step === "string") {
            canonical.push(step);
            local.push(step);
            node = undefined;
            break;
          }
          throw this.unknown(text, option, [...canonical, step], typeof step === "string" ? nearestKey(step, keys) : undefined, canonical, steps.slice(i + 1));
        }
        node = node.get(step, true);
      } else if (isSeq(node)) {
        if (typeof step !== "number" || step >= node.items.length)
          throw inputError("bad-option", option, `an index below ${node.items.length} at ${joinSteps(canonical)} (a path such as ${joinSteps([...canonical, 0])})`, describeFound(text));
        node = node.items[step];
      } else if (isScalar(node) && typeof node.value === "string" && canonical[canonical.length - 1] === "network" && file === "") {
        file = node.value;
        document = this.networkDocument(file, option);
        local = [];
        node = document.contents;
        i--;
        continue;
      } else {
        throw inputError("bad-option", option, `a path that ends at a quantity (${joinSteps(canonical)} holds a value, not a mapping or list)`, describeFound(text));
      }
      canonical.push(step);
      local.push(step);
    }
    if (node !== undefined && !isScalar(node))
      throw inputError("bad-option", option, `a path that ends at a quantity (${joinSteps(canonical)} is a ${isSeq(node) ? "list" : "mapping"})`, describeFound(text));
    const path = joinSteps(canonical);
    const partial: Omit<StudyParameter, "dimension" | "nominal"> = { path, file, steps: local, written: node === undefined ? "(not written)" : String(node.value) };
    const dimension = this.probeDimension(partial, text, option);
    const nominal = node === undefined ? undefined : parseQuantity(node.value, dimension, path);
    return { ...partial, dimension, nominal };
  }

  /**
   * Load the profile with the given values set, through loadProfile.
   * @throws InputError when the loader refuses a value (out of its range, for instance)
   */
  load(assignments: readonly StudyAssignment[]): DutyProfile {
    const { profile, files } = this.edited(assignments, (v) => v);
    return loadProfile(profile, this.file, this.reader(files));
  }

  /**
   * The edited documents as text, each value written with its SI unit ("0.0036 F"), for a
   * profile that reproduces a study's sample: the profile, and each edited network file by the
   * name the profile gives it. Cost O(size of the documents).
   */
  texts(assignments: readonly StudyAssignment[]): { readonly profile: string; readonly files: ReadonlyMap<string, string> } {
    return this.edited(assignments, (v, d) => (d === "dimensionless" ? v : `${v} ${DIMENSIONS[d].si}`));
  }

  private edited(assignments: readonly StudyAssignment[], write: (value: number, dimension: Dimension) => unknown): { profile: string; files: Map<string, string> } {
    const copies = new Map<string, Document>();
    for (const [parameter, value] of assignments) {
      let copy = copies.get(parameter.file);
      if (copy === undefined) {
        copy = (parameter.file === "" ? this.document : this.networks.get(parameter.file)!).clone();
        copies.set(parameter.file, copy);
      }
      copy.setIn(parameter.steps, write(value, parameter.dimension));
    }
    const files = new Map<string, string>();
    for (const [name, doc] of copies) if (name !== "") files.set(name, String(doc));
    return { profile: String(copies.get("") ?? this.document), files };
  }

  /** A file reader that serves edited files first, then the files read once. */
  private reader(edited: ReadonlyMap<string, string>): ReadNamedFile | undefined {
    const base = this.readNamed;
    if (base === undefined) return undefined;
    const read = (path: string): string => {
      const text = edited.get(path);
      if (text !== undefined) return text;
      let cached = this.readCache.get(path);
      if (cached === undefined) {
        cached = base(path);
        this.readCache.set(path, cached);
      }
      return cached;
    };
    return base.displayName === undefined ? read : Object.assign(read, { displayName: base.displayName });
  }

  private networkDocument(name: string, option: string): Document {
    let doc = this.networks.get(name);
    if (doc === undefined) {
      const text = this.reader(new Map())?.(name);
      doc = text === undefined ? undefined : parseDocument(text);
      if (doc === undefined || !isMap(doc.contents))
        throw inputError("bad-option", option, `a network file in YAML or JSON to reach into (${name} is not one)`, describeFound(name));
      this.networks.set(name, doc);
    }
    return doc;
  }

  /** Ask the loader what the field holds: its complaint about a marker names the dimension. */
  private probeDimension(parameter: Omit<StudyParameter, "dimension" | "nominal">, text: string, option: string): Dimension {
    const { profile, files } = this.edited([[{ ...parameter, dimension: "dimensionless", nominal: 0 }, 0]], () => PROBE_VALUE);
    const leaf = String(parameter.steps[parameter.steps.length - 1]);
    try {
      loadProfile(profile, this.file, this.reader(files));
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      for (const problem of error.problems) {
        if (problem.found.includes(PROBE_VALUE)) {
          const dimension = (Object.keys(DIMENSIONS) as Dimension[]).find((d) => problem.expected.startsWith(expectedWords(d)));
          if (dimension !== undefined) return dimension;
          if (/^a whole number/.test(problem.expected)) return "dimensionless";
        } else if (problem.expected.startsWith("one of the keys") && (problem.field === leaf || problem.field.endsWith(`.${leaf}`))) {
          const guess = /did you mean "([^"]+)"/.exec(problem.expected)?.[1];
          const steps = splitPath(parameter.path);
          throw this.unknown(text, option, steps, guess, steps.slice(0, -1), []);
        }
      }
    }
    throw inputError("bad-option", option, `a path to a quantity (a number with a unit; ${parameter.path} holds "${parameter.written}")`, describeFound(text));
  }

  private unknown(text: string, option: string, at: readonly Step[], guess: string | undefined, parent: readonly Step[], rest: readonly Step[]): InputError {
    const suggestion = guess === undefined ? "" : ` (did you mean "${joinSteps([...parent, guess, ...rest])}"?)`;
    return inputError("bad-option", option, `a parameter path of ${this.file}: ${joinSteps(at)} is not in it${suggestion}`, describeFound(text));
  }
}
