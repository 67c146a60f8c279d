// `npm run bench`: runs every test/bench/*.bench.ts in turn (each exports `run(print)`), prints
// its figures, and never fails on a speed figure: targets are read by people, not asserted.
import { readdirSync } from "node:fs";
import { fileURLToPath, pathToFileURL } from "node:url";

const folder = fileURLToPath(new URL(".", import.meta.url));
const only = process.argv.slice(2);
const files = readdirSync(folder)
  .filter((f) => f.endsWith(".bench.ts"))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();
for (const file of files) {
  const module = (await import(pathToFileURL(`${folder}${file}`).href)) as { run: (print: (line: string) => void) => Promise<void> };
  console.log(`\n## ${file.replace(/\.bench\.ts$/, "")}`);
  await module.run((line) => console.log(line));
}
