import { execFileSync } from "node:child_process";
import { fileURLToPath } from "node:url";

/** What one CLI run loaded: its exit status, the npm packages and the files of dist/. */
export interface CliModuleLoads {
  readonly status: number;
  /** npm package names, sorted ("zod", "ml-fcnnls", ...) */
  readonly packages: readonly string[];
  /** files of the built library, relative to the project ("dist/cli/main.js", ...), sorted */
  readonly dist: readonly string[];
}

// The child process: a resolve hook (module.register, run in Node's loader thread) appends every
// URL the ES module loader resolves to a log file; appendFileSync finishes before the hook
// returns, so the log is complete when the run ends. CommonJS files that CommonJS code requires
// never reach that hook, so the require cache is added. Then it imports dist/cli/main.js, runs
// runCli with the given arguments and an io that reads real files, discards output and refuses
// to write, and prints what was loaded as one JSON object.
const CHILD = `
import { createRequire, register } from "node:module";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
const folder = mkdtempSync(join(tmpdir(), "heatledger-loads-"));
const log = join(folder, "resolved.txt");
const hooks = [
  'import { appendFileSync } from "node:fs";',
  "let log;",
  "export function initialize(data) { log = data.log; }",
  "export async function resolve(specifier, context, next) {",
  "  const result = await next(specifier, context);",
  '  appendFileSync(log, result.url + "\\\\n");',
  "  return result;",
  "}",
].join("\\n");
register("data:text/javascript," + encodeURIComponent(hooks), { data: { log } });
const { runCli } = await import(pathToFileURL(join(process.cwd(), "dist/cli/main.js")).href);
const io = {
  out: () => {},
  err: () => {},
  readFile: (path) => readFileSync(path, "utf8"),
  writeFile: () => { throw new Error("this run must not write files"); },
  exists: (path) => existsSync(path),
  columns: 100,
};
const status = await runCli(process.argv.slice(1), io);
const resolved = existsSync(log) ? readFileSync(log, "utf8").split("\\n").filter((line) => line.startsWith("file:")) : [];
rmSync(folder, { recursive: true, force: true });
const files = [...resolved.map((url) => new URL(url).pathname), ...Object.keys(createRequire(import.meta.url).cache)];
const packages = new Set(files.map((file) => /node_modules\\/((?:@[^/]+\\/)?[^/]+)\\//.exec(file)?.[1]).filter((name) => name !== undefined));
const root = process.cwd() + "/";
const dist = new Set(files.filter((file) => file.startsWith(root + "dist/")).map((file) => file.slice(root.length)));
console.log(JSON.stringify({ status, packages: [...packages].sort(), dist: [...dist].sort() }));
`;

/**
 * Run the built CLI (dist/cli/main.js, as bin/heatledger.js does) in a fresh Node process with
 * these arguments and report every module it loaded, the lazily imported ones included.
 * Needs dist/ (built by vitest's global setup).
 */
export function cliModuleLoads(args: readonly string[]): CliModuleLoads {
  const root = fileURLToPath(new URL("../..", import.meta.url));
  const output = execFileSync(process.execPath, ["--input-type=module", "-e", CHILD, "--", ...args], {
    cwd: root,
    encoding: "utf8",
    stdio: ["ignore", "pipe", "pipe"],
  });
  return JSON.parse(output) as CliModuleLoads;
}
