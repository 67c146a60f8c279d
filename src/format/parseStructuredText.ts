import { LineCounter, isMap, isScalar, isSeq, parseDocument, type Node } from "yaml";
import { InputError } from "../errors/InputError.js";

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
  const doc = parseDocument(text, { lineCounter, uniqueKeys: true, prettyErrors: false });
  if (doc.errors.length > 0) {
    throw new InputError(
      doc.errors.map((e) => ({
        code: "bad-file" as const,
        file,
        line: lineCounter.linePos(e.pos[0]).line,
        field: "",
        expected: "valid YAML or JSON",
        found: e.message.split("\n")[0]!,
      })),
    );
  }
  const data: unknown = doc.toJS({ maxAliasCount: 100 });
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
