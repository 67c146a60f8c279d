import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { runCli } from "../../src/cli/main.js";
import { memoryIo } from "./memoryIo.js";

// The CLI fuzzer shared by test/cli/fuzzCli.test.ts (a few hundred cases in the suite) and
// test/bench/fuzz.ts (`npm run fuzz`, a longer campaign): the bundled profiles, networks and
// field log, each mutated by a seeded generator, run through runCli in process (the bin's own
// entry) with the files in memory. Every run must end with exit 0, 1 or 2, no stack trace and no
// NaN, Infinity or undefined in what it prints.

/** mulberry32: a public-domain 32-bit generator, seeded so that every campaign is reproducible. */
export function seededUniform(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Values that have broken parsers and solvers before: overflow, underflow, signs, non-numbers, units of the wrong kind. */
const HOSTILE_VALUES = [
  "0", "-1", "1e308", "-1e308", "1e-308", "5e-324", "NaN", ".inf", "-.inf", "~", '""', "1.5", "9007199254740993", "-0",
  "1e-7 V", "1e308 ohm", "1e308 K/W", "0 s", "2 kg", "40 degC", "0 K", "abc", "[]", "{}", "0x1F", "1e6", "\"\\u001b[31m\"",
];
/** Fragments of YAML, CSV and control text spliced into a line. */
const FRAGMENTS = ["&a ", "*a", "<<: *a", "!!binary ", "{", "}", "[", "]", ": ", "- ", ",", "#", "'", '"', "\t", "\r", "\u0000", "\u001b[2J", "\u202e", "\uFFFD", "%YAML 1.1\n", "---\n", "..."];

/** One mutation of a text, picked and placed by the generator. */
export function mutateText(text: string, random: () => number): string {
  const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)]!;
  const lines = text.split("\n");
  const at = Math.floor(random() * lines.length);
  switch (Math.floor(random() * 9)) {
    case 0: {
      // a number (with its unit, if any) replaced by a hostile value
      const numbers = [...text.matchAll(/-?\d+(\.\d+)?(e-?\d+)?( ?[A-Za-z/°]+)?/g)];
      if (numbers.length === 0) return text;
      const n = pick(numbers);
      return text.slice(0, n.index) + pick(HOSTILE_VALUES) + text.slice(n.index! + n[0].length);
    }
    case 1:
      lines.splice(at, 1);
      return lines.join("\n");
    case 2:
      lines.splice(at, 0, lines[at] ?? "");
      return lines.join("\n");
    case 3: {
      const other = Math.floor(random() * lines.length);
      [lines[at], lines[other]] = [lines[other]!, lines[at]!];
      return lines.join("\n");
    }
    case 4: {
      const line = lines[at] ?? "";
      const col = Math.floor(random() * (line.length + 1));
      lines[at] = line.slice(0, col) + pick(FRAGMENTS) + line.slice(col);
      return lines.join("\n");
    }
    case 5:
      return text.slice(0, Math.floor(random() * text.length));
    case 6:
      lines[at] = random() < 0.5 ? ` ${lines[at] ?? ""}` : (lines[at] ?? "").replace(/^ /, "");
      return lines.join("\n");
    case 7: {
      // a number multiplied or divided by a power of ten
      const numbers = [...text.matchAll(/\b\d+(\.\d+)?\b/g)];
      if (numbers.length === 0) return text;
      const n = pick(numbers);
      const scaled = Number(n[0]) * 10 ** (Math.floor(random() * 7) - 3);
      return text.slice(0, n.index) + String(scaled) + text.slice(n.index! + n[0].length);
    }
    default: {
      const keys = [...text.matchAll(/^(\s*-?\s*)([A-Za-z]+):/gm)];
      if (keys.length === 0) return text;
      const k = pick(keys);
      const start = k.index! + k[1]!.length;
      return text.slice(0, start) + pick(["", "x", k[2]!.slice(1), k[2]!.toUpperCase(), "events", "repeat", "count"]) + text.slice(start + k[2]!.length);
    }
  }
}

/** A case: the command line and the files it reads (paths relative to the profiles folder). */
export interface FuzzCase {
  readonly argv: readonly string[];
  readonly files: Record<string, string>;
}

/** The bundled files, by path relative to profiles/. */
export function bundledFiles(root: string): Record<string, string> {
  const files: Record<string, string> = {};
  const walk = (dir: string, prefix: string): void => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const path = prefix === "" ? entry.name : `${prefix}/${entry.name}`;
      if (entry.isDirectory()) walk(join(dir, entry.name), path);
      else files[path] = readFileSync(join(dir, entry.name), "utf8");
    }
  };
  walk(join(root, "profiles"), "");
  return files;
}

/**
 * The case number `index` of a campaign: a command over a bundled file, with one to three
 * mutations applied to the file the command reads first (the profile, the log or the network).
 */
export function fuzzCase(files: Record<string, string>, random: () => number): FuzzCase {
  const profiles = Object.keys(files).filter((p) => !p.includes("/") && p.endsWith(".yaml"));
  const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)]!;
  const roll = random();
  let argv: string[];
  let target: string;
  if (roll < 0.55) {
    target = pick(profiles);
    argv = ["simulate", target, ...(random() < 0.3 ? ["--json"] : [])];
  } else if (roll < 0.65) {
    target = pick(profiles);
    argv = [pick(["supervise", "size", "retries"]), target];
  } else if (roll < 0.8) {
    target = "logs/irrigation-pump-returned-unit.csv";
    argv = ["replay", target, "--profile", "irrigation-pump-decade.yaml"];
  } else if (roll < 0.9) {
    target = pick(["networks/mosfet-on-heatsink-graph.yaml", "networks/wirewound-resistor-foster.yaml"]);
    argv = random() < 0.5 ? ["network", "show", target] : ["network", "convert", target, "--to", pick(["foster", "cauer"])];
  } else {
    target = pick(profiles);
    // a network file a profile names is mutated instead of the profile
    const named = /network: (networks\/\S+)/.exec(files[target]!)?.[1];
    if (named !== undefined) target = named;
    argv = ["simulate", pick(profiles.filter((p) => named === undefined || files[p]!.includes(named))) ?? profiles[0]!];
  }
  let text = files[target]!;
  const count = 1 + Math.floor(random() * 3);
  for (let i = 0; i < count; i++) text = mutateText(text, random);
  return { argv, files: { ...files, [target]: text } };
}

/** What a run printed and how it ended. */
export interface FuzzOutcome {
  readonly status: number;
  readonly out: string;
  readonly err: string;
}

/** Run one case in process. */
export async function runFuzzCase(c: FuzzCase): Promise<FuzzOutcome> {
  const io = memoryIo({ ...c.files });
  const status = await runCli(c.argv, io);
  return { status, out: io.stdout.join(""), err: io.stderr.join("") };
}

/**
 * The problems of one outcome ([] when it is clean): an exit status outside 0, 1, 2, a stack
 * trace or an internal error, NaN, Infinity or undefined printed as a value.
 */
export function fuzzProblems(o: FuzzOutcome): string[] {
  const problems: string[] = [];
  if (![0, 1, 2].includes(o.status)) problems.push(`exit ${o.status}`);
  const all = `${o.out}\n${o.err}`;
  if (/\n\s+at .*[^\s()]+\.(js|ts|mjs|cjs):\d+:\d+\)?/.test(all) || /^\w*Error: /m.test(all)) problems.push("a stack trace");
  if (/internal error/.test(all)) problems.push("an internal error");
  // as a value: not inside a quoted echo of what the user wrote (found "NaN" is a fair message)
  // nor a refusal echoing a non-finite number the file held (`.inf` is read as Infinity)
  const unquoted = all.replace(/"(?:[^"\\\n]|\\.)*"/g, '""').replace(/found -?(NaN|Infinity)\b/g, "found");
  for (const word of ["NaN", "Infinity", "undefined"]) if (new RegExp(`(?<![A-Za-z])${word}(?![A-Za-z])`).test(unquoted)) problems.push(`${word} in the output`);
  return problems;
}
