import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import ts from "typescript";
import { describe, expect, test } from "vitest";
import * as api from "../../src/index.js";

// Every function and class of the public API (src/index.ts) carries an `@example` in its TSDoc,
// and every example runs here. An example is JavaScript (type annotations are stripped) with
// every name of the public API in scope, plus:
//   bundled(path)  the text of a file under profiles/ (a bundled profile, network or log)
//   profile(name)  a bundled profile loaded as `heatledger simulate` loads it
// A line ending in `// => VALUE` is checked: the expression before the comment must equal VALUE
// (numbers to the digits written, strings exactly, arrays and objects member by member), so the
// examples cannot drift from what the code does.

const ROOT = join(dirname(fileURLToPath(import.meta.url)), "..", "..");

function bundled(path: string): string {
  return readFileSync(join(ROOT, "profiles", path), "utf8");
}

function profile(name: string): unknown {
  return api.loadProfile(bundled(name), join("profiles", name), bundled);
}

interface ApiExample {
  readonly name: string;
  readonly file: string;
  readonly code: string | undefined;
}

/** The TSDoc `@example` of every runtime export of src/index.ts, read with the TypeScript compiler. */
function apiExamples(): ApiExample[] {
  const entry = join(ROOT, "src", "index.ts");
  const program = ts.createProgram([entry], { module: ts.ModuleKind.NodeNext, moduleResolution: ts.ModuleResolutionKind.NodeNext, target: ts.ScriptTarget.ES2022, strict: true });
  const checker = program.getTypeChecker();
  const moduleSymbol = checker.getSymbolAtLocation(program.getSourceFile(entry)!)!;
  const out: ApiExample[] = [];
  for (const exported of checker.getExportsOfModule(moduleSymbol)) {
    const name = exported.getName();
    if (typeof (api as Record<string, unknown>)[name] !== "function") continue;
    const symbol = exported.flags & ts.SymbolFlags.Alias ? checker.getAliasedSymbol(exported) : exported;
    const declaration = symbol.declarations?.find((d) => ts.isFunctionDeclaration(d) || ts.isClassDeclaration(d)) ?? symbol.declarations?.[0];
    if (declaration === undefined) continue;
    const tag = ts.getJSDocTags(declaration).find((t) => t.tagName.text === "example");
    const text = tag === undefined ? undefined : typeof tag.comment === "string" ? tag.comment : ts.getTextOfJSDocComment(tag.comment);
    out.push({ name, file: declaration.getSourceFile().fileName.slice(ROOT.length + 1), code: text?.trim() });
  }
  return out.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
}

/** VALUE of `// => VALUE` matches `actual`: numbers to the digits written (half a unit of the last), the rest structurally. */
function matches(actual: unknown, expected: unknown, written: string): boolean {
  if (typeof expected === "number" && typeof actual === "number") {
    const digits = /(?:\.(\d+))?(?:e([-+]?\d+))?$/i.exec(written.trim());
    const decimals = digits?.[1]?.length ?? 0;
    const exponent = Number(digits?.[2] ?? 0);
    if (!Number.isFinite(expected)) return Object.is(actual, expected);
    return Math.abs(actual - expected) <= 0.5 * 10 ** (exponent - decimals) + 1e-12 * Math.abs(expected);
  }
  if (Array.isArray(expected)) {
    const parts = splitTopLevel(written.trim().slice(1, -1));
    return Array.isArray(actual) && actual.length === expected.length && expected.every((e, i) => matches(actual[i], e, parts[i] ?? ""));
  }
  if (expected !== null && typeof expected === "object") {
    const parts = splitTopLevel(written.trim().slice(1, -1));
    return (
      actual !== null &&
      typeof actual === "object" &&
      Object.keys(expected).every((k, i) => matches((actual as Record<string, unknown>)[k], (expected as Record<string, unknown>)[k], (parts[i] ?? "").replace(/^[^:]*:/, "")))
    );
  }
  return Object.is(actual, expected);
}

/** Split "a, [b, c], {d: e}" at its top-level commas. */
function splitTopLevel(text: string): string[] {
  const parts: string[] = [];
  let depth = 0;
  let quote = "";
  let start = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quote !== "") {
      if (c === quote && text[i - 1] !== "\\") quote = "";
    } else if (c === '"' || c === "'") quote = c;
    else if ("[{(".includes(c)) depth++;
    else if ("]})".includes(c)) depth--;
    else if (c === "," && depth === 0) {
      parts.push(text.slice(start, i));
      start = i + 1;
    }
  }
  parts.push(text.slice(start));
  return parts;
}

const examples = apiExamples();

describe("every function and class of the public API has an example that runs", () => {
  test("the list covers the public API", () => {
    const functions = Object.entries(api).filter(([, v]) => typeof v === "function").map(([k]) => k).sort();
    expect(examples.map((e) => e.name)).toEqual(functions);
  });

  test.each(examples)("$name ($file)", ({ name, file, code }) => {
    expect(code, `${file}: ${name} has no @example in its TSDoc`).toBeDefined();
    const checks: { expected: unknown; written: string; line: string }[] = [];
    const lines = code!.split("\n").map((line) => {
      const at = line.indexOf("// =>");
      if (at < 0) return line;
      const written = line.slice(at + 5).trim();
      checks.push({ expected: new Function(`return (${written});`)(), written, line: line.trim() });
      return `__check(${checks.length - 1}, ${line.slice(0, at).trim().replace(/;$/, "")});`;
    });
    const js = ts.transpileModule(lines.join("\n"), { compilerOptions: { target: ts.ScriptTarget.ES2022, module: ts.ModuleKind.ESNext } }).outputText;
    const seen: unknown[] = [];
    const scope: Record<string, unknown> = { ...api, bundled, profile, __check: (i: number, v: unknown) => (seen[i] = v) };
    new Function(...Object.keys(scope), js)(...Object.values(scope));
    expect(checks.length, `${name}: an example shows at least one result with // =>`).toBeGreaterThan(0);
    checks.forEach((c, i) => {
      expect(matches(seen[i], c.expected, c.written), `${name}: ${c.line}\n  gave ${JSON.stringify(seen[i])}`).toBe(true);
    });
  });
});
