import { createRequire } from "node:module";

type CsvParse = typeof import("csv-parse/sync");
type CsvStringify = typeof import("csv-stringify/sync");

const require = createRequire(import.meta.url);
let parser: CsvParse | undefined;
let writer: CsvStringify | undefined;

/**
 * csv-parse's and csv-stringify's synchronous functions, each package loaded (its CommonJS build,
 * synchronously) on the first call rather than when a module that may need it is imported: a
 * run that reads no CSV table and writes no CSV file (most `simulate` runs) does not pay for
 * loading them. Same functions, same options, same results.
 * Cost: one package load per process, on first use.
 */
export const lazyCsv: { readonly parse: CsvParse["parse"]; readonly stringify: CsvStringify["stringify"] } = {
  parse: ((...args: Parameters<CsvParse["parse"]>) => (parser ??= require("csv-parse/sync") as CsvParse).parse(...args)) as CsvParse["parse"],
  stringify: ((...args: Parameters<CsvStringify["stringify"]>) => (writer ??= require("csv-stringify/sync") as CsvStringify).stringify(...args)) as CsvStringify["stringify"],
};
