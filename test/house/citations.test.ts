import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, test } from "vitest";

// One edition per book and one section per result: every comment in src/ and test/ that names a
// book of docs/references.md ("Textbooks and handbooks") must state that book's edition, if it
// states one, and only sections the table lists for it. The table is read from the document, so
// a new citation is added there first. A failure lists each offending citation with its file.

const ROOT = join(import.meta.dirname, "..", "..");

interface Book {
  /** words that name the book in a comment: the first author's surname and the title */
  readonly keys: readonly string[];
  /** "7th" for "7th ed. (2011)"; undefined for a book with one edition */
  readonly edition: string | undefined;
  /** every "§x.y" the table lists for the book */
  readonly sections: ReadonlySet<string>;
}

const SECTION = /§\s?([IVX]+\.\d+|\d+(?:\.\d+)*)/g;
const EDITION = /\b(\d+(?:st|nd|rd|th)) ed(?:\.|ition)/g;

/** The books of the references table: a row with a book cell starts a book, rows below add results. */
export function readBooks(markdown: string): Book[] {
  const table = markdown.split("## Textbooks and handbooks")[1]!.split("\n## ")[0]!;
  const books: { keys: string[]; edition: string | undefined; sections: Set<string> }[] = [];
  for (const line of table.split("\n")) {
    const cells = line.split("|").map((c) => c.trim());
    if (cells.length < 6 || cells[1] === "book" || cells[1]!.startsWith("---")) continue;
    const [, book, edition, , where] = cells as [string, string, string, string, string];
    if (book !== "") {
      const title = /\*([^*]+)\*/.exec(book)?.[1];
      const surname = book.includes("(SI brochure)") ? "SI brochure" : /^[\p{L}-]+/u.exec(book)![0];
      books.push({ keys: [surname, ...(title === undefined ? [] : [title])], edition: /(\d+(?:st|nd|rd|th)) ed/.exec(edition)?.[1], sections: new Set() });
    }
    for (const m of where.matchAll(SECTION)) books.at(-1)!.sections.add(m[1]!);
  }
  return books;
}

/** A file's text with comment markers removed and lines joined, so a citation reads as one run of words. */
function flatten(text: string): string {
  return text.replace(/\n\s*(?:\/\/+|\/\*\*|\*\/|\*)?[ \t]?/g, " ");
}

/** Each citation of a book in a file: where it starts in the flattened text, the book and its words. */
export function citations(text: string, books: readonly Book[]): { at: number; book: Book; window: string }[] {
  const flat = flatten(text);
  const escape = (key: string): string => key.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
  const starts = books.flatMap((book) => book.keys.flatMap((key) => [...flat.matchAll(new RegExp(`\\b${escape(key)}\\b`, "g"))].map((m) => ({ at: m.index, book }))));
  starts.sort((a, b) => a.at - b.at);
  return starts.map(({ at, book }, i) => {
    // the citation runs to the next other book, the end of the clause or sentence, or 240 characters
    const next = starts.slice(i + 1).find((s) => s.book !== book)?.at ?? flat.length;
    const window = flat.slice(at, Math.min(next, at + 240));
    const stop = /;|\.\s+[A-Z]|Source:/.exec(window.slice(1));
    return { at, book, window: stop === null ? window : window.slice(0, stop.index + 1) };
  });
}

/** What the citations of a file state about editions and sections that the table does not list. */
export function citationProblems(text: string, books: readonly Book[]): string[] {
  // keyed by the offending text's position, so a book named by author and title is reported once
  const problems = new Map<number, string>();
  for (const { at, book, window } of citations(text, books)) {
    for (const m of window.matchAll(EDITION))
      if (m[1] !== book.edition && !problems.has(at + m.index)) problems.set(at + m.index, `${book.keys[0]}: ${m[0]} (the table has ${book.edition ?? "no edition"}): "${window.trim()}"`);
    for (const m of window.matchAll(SECTION))
      if (!book.sections.has(m[1]!) && !problems.has(at + m.index)) problems.set(at + m.index, `${book.keys[0]}: §${m[1]} is not a section the table lists: "${window.trim()}"`);
  }
  return [...problems.values()];
}

function filesBelow(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? filesBelow(path) : [path];
  });
}

describe("citations", () => {
  const books = readBooks(readFileSync(join(ROOT, "docs", "references.md"), "utf8"));

  test("the references table is read: books, editions and sections", () => {
    const incropera = books.find((b) => b.keys[0] === "Incropera")!;
    expect(incropera.keys).toContain("Fundamentals of Heat and Mass Transfer");
    expect(incropera.edition).toBe("7th");
    expect([...incropera.sections].sort()).toEqual(["1.3.1", "3.1.2", "5.1", "5.2", "5.3"]);
    expect(books.find((b) => b.keys[0] === "Desoer")!.edition).toBeUndefined();
    expect(books.find((b) => b.keys[0] === "Hairer")!.sections.has("II.9")).toBe(true);
    expect(books.find((b) => b.keys[0] === "SI brochure")!.edition).toBe("9th");
  });

  test("every comment in src/ and test/ cites a book at its one edition and at the sections listed", () => {
    const files = [...filesBelow(join(ROOT, "src")), ...filesBelow(join(ROOT, "test"))].filter((f) => f.endsWith(".ts") && !f.endsWith("citations.test.ts"));
    const texts = files.map((file) => ({ file, text: readFileSync(file, "utf8") }));
    // the scan sees the tree's citations (about 120 when this was written), so a pass means something
    expect(texts.reduce((n, { text }) => n + citations(text, books).length, 0)).toBeGreaterThan(100);
    const hits = texts.flatMap(({ file, text }) => citationProblems(text, books).map((p) => `${relative(ROOT, file)}: ${p}`));
    expect(hits).toEqual([]);
  });

  test("the scan catches another edition and an unlisted section, and passes the listed forms", () => {
    expect(citationProblems("// Incropera et al., Fundamentals of Heat and Mass Transfer, 6th\n// ed., §5.1, lumped", books)).toHaveLength(1);
    expect(citationProblems(" * Source: Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.4", books)).toHaveLength(1);
    expect(citationProblems("// (Hayt §1.4); exact segment integral", books)).toHaveLength(1);
    expect(citationProblems("// Incropera et al., 7th ed. (2011), §5.1 and §5.3; bisection, Press et al., Numerical Recipes, 3rd ed. (2007), §9.1.", books)).toEqual([]);
    expect(citationProblems("// SI brochure, 9th ed. (BIPM 2019), §3, Table 7 (prefixes)", books)).toEqual([]);
  });
});
