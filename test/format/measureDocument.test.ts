import { describe, expect, test } from "vitest";
import { InputError, parseStructuredText } from "../../src/internal.js";

// Documents built to exhaust memory or the stack: refused with a line before they become data.
function refusal(text: string): string {
  try {
    parseStructuredText(text, "d.yaml");
  } catch (error) {
    if (error instanceof InputError) return error.message;
    throw error;
  }
  return "accepted";
}

describe("YAML documents are measured before they are turned into data", () => {
  test('"billion laughs": nine levels of nine aliases each would expand to 9^9 values; refused at the line that passes the limit', () => {
    // line 6 (f) is the first whose expansion passes 500,000: 9^6 = 531,441 strings
    let text = 'a: &a ["lol","lol","lol","lol","lol","lol","lol","lol","lol"]\n';
    const names = "abcdefghi";
    for (let i = 1; i < names.length; i++) text += `${names[i]}: &${names[i]} [${Array(9).fill(`*${names[i - 1]}`).join(",")}]\n`;
    expect(refusal(text)).toBe("d.yaml:6: expected a document that expands to at most 500000 values (set HEATLEDGER_MAX_NODES to raise it), found more than 500000 values by this line");
  });

  test("one anchor used 150 times is ordinary data, not an attack", () => {
    const text = `a: &x { r: 1 K/W, tau: 2 s }\nlist: [${Array(150).fill("*x").join(", ")}]\n`;
    const parsed = parseStructuredText(text, "d.yaml");
    expect((parsed.data as { list: unknown[] }).list).toHaveLength(150);
    expect((parsed.data as { list: { tau: string }[] }).list[149]!.tau).toBe("2 s");
  });

  test("nesting deeper than the limit is refused at its line; an alias counts its source's depth", () => {
    expect(refusal(`${"[".repeat(70)}${"]".repeat(70)}\n`)).toBe("d.yaml:1: expected a document nested at most 64 levels (set HEATLEDGER_MAX_DEPTH to raise it), found 65 levels by this line");
    const deep = `a: &a ${"[".repeat(40)}${"]".repeat(40)}\nb: ${"[".repeat(30)}*a${"]".repeat(30)}\n`;
    expect(refusal(deep)).toBe("d.yaml:2: expected a document nested at most 64 levels (set HEATLEDGER_MAX_DEPTH to raise it), found 71 levels by this line");
  });

  test("700 nested block lists (beyond the parser's own stack) are refused as too deep, not a stack trace", () => {
    let text = "";
    for (let i = 0; i < 700; i++) text += `${" ".repeat(i * 2)}- \n`;
    expect(refusal(text)).toMatch(/^d\.yaml:\d+: expected a document nested at most 64 levels \(set HEATLEDGER_MAX_DEPTH to raise it\), found /);
  });

  test("a flat list of a million values is refused by counting separators, before the parser's 1 KB per value", () => {
    // separators: one ":", one "[", 999,999 commas, one newline
    expect(refusal(`x: [${Array(1_000_000).fill("0").join(",")}]\n`)).toBe(
      "d.yaml: expected a document of at most 500000 values (set HEATLEDGER_MAX_NODES to raise it), found 1000002 separators before parsing",
    );
  });
});
