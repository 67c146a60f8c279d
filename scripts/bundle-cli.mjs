// Bundle the compiled CLI (dist/cli) into dist/bundle/cli for bin/heatledger.js.
//
// Why: a fresh `heatledger simulate` spent about a third of its start-up resolving and compiling
// some 250 small ES modules (150 of dist/, 95 of zod, whose entry also pulls in every message
// locale). One bundle per command, split at the same dynamic imports as dist/ (each command's
// action is still loaded only when it runs), cuts the start-up CPU by about a quarter and drops
// the unused zod locales by tree shaking. The library entry points (dist/index.js,
// dist/internal.js) and the module-loading tests keep using the unbundled dist/.
//
// Layout: entries keep their place under dist/ (dist/cli/main.js -> dist/bundle/cli/main.js,
// every dist/cli/*Worker.js likewise) and shared chunks sit one folder below them
// (dist/bundle/cli/commands/), where the command actions sit in dist/; so a path an action builds
// from its own import.meta.url (the worker scripts, "../NAMEWorker.js") names the bundled worker.
// Packages that are loaded lazily and heavy (mathjs, the fitting, ODE, chart and worker-pool
// libraries) stay outside the bundle and load from node_modules as before.
import { mkdirSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { dirname } from "node:path";
import { build } from "esbuild";

// The CommonJS packages inside the bundle (commander, yaml) call require for Node's own modules,
// through esbuild's __require shim, which reads a free `require`: a chunk that names it gets this
// line. Only those (the shim's chunk): each createRequire and import.meta costs start-up time
// in every one of the fifty-odd chunks simulate loads.
const REQUIRE_LINE = 'import { createRequire as __heatledgerRequire } from "node:module"; const require = __heatledgerRequire(import.meta.url);\n';

const workers = readdirSync("dist/cli")
  .filter((file) => file.endsWith("Worker.js"))
  .map((file) => `dist/cli/${file}`);

// a clean folder: chunk names change with their content, and stale chunks would only mislead
rmSync("dist/bundle", { recursive: true, force: true });
const result = await build({
  entryPoints: ["dist/cli/main.js", ...workers],
  outbase: "dist",
  outdir: "dist/bundle",
  entryNames: "[dir]/[name]",
  chunkNames: "cli/commands/[name]-[hash]",
  bundle: true,
  splitting: true,
  format: "esm",
  platform: "node",
  target: "node20",
  external: ["mathjs", "vega", "vega-lite", "puppeteer-core", "piscina", "odex", "ml-fcnnls", "ml-levenberg-marquardt"],
  write: false,
  logLevel: "warning",
});
for (const file of result.outputFiles) {
  mkdirSync(dirname(file.path), { recursive: true });
  writeFileSync(file.path, /\brequire\b/.test(file.text) ? REQUIRE_LINE + file.text : file.text);
}
