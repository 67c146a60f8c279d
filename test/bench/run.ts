// `npm run bench`: runs every test/bench/*.bench.ts in turn (each exports `run(print)`), prints
// its figures, and never fails on a speed figure: targets are read by people, not asserted.
// package.json compiles the benches and the library with tsc (tsconfig.bench.json, into
// .bench-build/) and runs this file with plain node, as users run the built CLI: a
// source-transforming loader adds wrappers to every function and would understate the speed.
import { readdirSync } from "node:fs";
import { fileURLToPath, pathToFileURL } from "node:url";

const folder = fileURLToPath(new URL(".", import.meta.url));
const only = process.argv.slice(2);
const suffix = import.meta.url.endsWith(".ts") ? ".bench.ts" : ".bench.js";
const files = readdirSync(folder)
  .filter((f) => f.endsWith(suffix))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();
for (const file of files) {
  const module = (await import(pathToFileURL(`${folder}${file}`).href)) as { run: (print: (line: string) => void) => Promise<void> };
  console.log(`\n## ${file.slice(0, -suffix.length)}`);
  await module.run((line) => console.log(line));
}
