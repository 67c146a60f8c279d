// vitest global setup: compile src/ to dist/ once and bundle the CLI as the bin runs it
// (scripts/bundle-cli.mjs), so end-to-end tests spawn the real bin.
import { execFileSync } from "node:child_process";
import { fileURLToPath } from "node:url";

export default function setup(): void {
  const root = fileURLToPath(new URL("../..", import.meta.url));
  for (const script of [["node_modules/typescript/bin/tsc", "-p", "tsconfig.build.json"], ["scripts/bundle-cli.mjs"]]) {
    execFileSync(process.execPath, script, { cwd: root, stdio: "inherit" });
  }
}
