import { LineCounter, isMap, isScalar, isSeq, parseDocument, type Node } from "yaml";
import { InputError } from "../errors/InputError.js";
import { inputLimit, limitWords } from "./inputLimits.js";
import { measureDocument } from "./measureDocument.js";

/** Parsed YAML or JSON text with a way back from a field path to its line. */
export interface StructuredText {
  /** the plain data (objects, arrays, strings, numbers, booleans, null) */
  readonly data: unknown;
  /**
   * 1-based line of a dotted field path such as `parts[0].network.stages[2].r`; the line of the
   * nearest existing ancestor when the field itself is missing; 0 when unknown.
   */
  readonly lineOf: (field: string) => number;
}

/** Split `a.b[2].c` into ["a", "b", 2, "c"]. */
export function splitFieldPath(field: string): (string | number)[] {
  const parts: (string | number)[] = [];
  for (const piece of field.split(".")) {
    const match = /^([^[\]]*)((?:\[\d+\])*)$/.exec(piece);
    if (match === null) {
      parts.push(piece);
      continue;
    }
    if (match[1] !== "") parts.push(match[1]!);
    for (const index of match[2]!.matchAll(/\[(\d+)\]/g)) parts.push(Number(index[1]));
  }
  return parts;
}

/**
 * Parse YAML (JSON is valid YAML, so both go through the same parser) into plain data, keeping
 * the line of every node so that validation errors can name `file:line`. Duplicate keys and
 * syntax errors are reported as InputError `bad-file` with their line.
 * Source: YAML 1.2.2 specification (2021), §3.2 (representation graph); `yaml` package API.
 * Cost O(length of text).
 * @param text the file's contents
 * @param file the file's name, for messages
 * @throws InputError `bad-file`
 */
export function parseStructuredText(text: string, file: string): StructuredText {
  const lineCounter = new LineCounter();
  const refuse = (line: number, expected: string, found: string): InputError =>
    new InputError({ code: "bad-file", file, line, field: "", expected, found });
  const separators = countSeparators(text);
  if (separators > 1.5 * inputLimit("maxDocumentNodes"))
    throw refuse(0, `a document of at most ${limitWords("maxDocumentNodes", "values")}`, `${separators} separators before parsing`);
  let doc: ReturnType<typeof parseDocument>;
  try {
    doc = parseDocument(text, { lineCounter, uniqueKeys: true, prettyErrors: false });
  } catch (error) {
    // the parser recurses once per level: a deep enough document exhausts the stack
    if (error instanceof RangeError) throw refuse(0, `a document nested at most ${limitWords("maxNestingDepth", "levels")}`, "a document nested deeper than the parser can follow");
    throw error;
  }
  if (doc.errors.length > 0) {
    throw new InputError(
      doc.errors.map((e) => {
        const line = lineCounter.linePos(e.pos[0]).line;
        const message = e.message.split("\n")[0]!;
        return /call stack/i.test(message)
          ? { code: "bad-file" as const, file, line, field: "", expected: `a document nested at most ${limitWords("maxNestingDepth", "levels")}`, found: "a document nested deeper than the parser can follow" }
          : { code: "bad-file" as const, file, line, field: "", expected: "valid YAML or JSON", found: message };
      }),
    );
  }
  // measured before toJS: the depth and the size once aliases are expanded are bounded, so an
  // alias bomb or a deep nest is refused with a line instead of exhausting memory or the stack
  measureDocument(doc.contents, (node) => (node?.range ? lineCounter.linePos(node.range[0]).line : 0), refuse);
  let data: unknown;
  try {
    data = doc.toJS({ maxAliasCount: -1 });
  } catch (error) {
    if (error instanceof RangeError || error instanceof ReferenceError) throw refuse(0, "valid YAML or JSON", error.message);
    throw error;
  }
  const lineOf = (field: string): number => {
    let node: unknown = doc.contents;
    let line = 0;
    const lineOfNode = (n: unknown): number => {
      const range = (n as Node | null)?.range;
      return range ? lineCounter.linePos(range[0]).line : 0;
    };
    line = lineOfNode(node);
    for (const key of splitFieldPath(field)) {
      if (isMap(node)) {
        const pair = node.items.find((p) => isScalar(p.key) && String(p.key.value) === String(key));
        if (pair === undefined) return line;
        const keyLine = lineOfNode(pair.key);
        node = pair.value;
        line = lineOfNode(node) || keyLine || line;
        if (!isMap(node) && !isSeq(node)) line = keyLine || line;
      } else if (isSeq(node) && typeof key === "number") {
        const item = node.items[key];
        if (item === undefined) return line;
        node = item;
        line = lineOfNode(node) || line;
      } else {
        return line;
      }
    }
    return line;
  };
  return { data, lineOf };
}

/** Count the characters that can start or separate YAML values (`,` `:` `[` `{` newline): an upper guess of the values, cheap to take before the parser's 1 KB per value. */
function countSeparators(text: string): number {
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 44 || c === 58 || c === 91 || c === 123 || c === 10) n++;
  }
  return n;
}
