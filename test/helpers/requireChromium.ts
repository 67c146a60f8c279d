// One rule for the browser the report tests open pages in (Debian package `chromium`, driven by
// puppeteer-core, which never downloads a browser): a test that needs it fails with this message
// when it is missing, never skips. `.ci/run` installs the package.
import { spawnSync } from "node:child_process";

export const CHROMIUM_MISSING =
  "chromium is not installed: the report browser tests need the Debian package chromium (apt-get install -y chromium; .ci/run installs it)";

/** The path of the chromium binary; throws the one clear message when there is none. */
export function requireChromium(): string {
  const found = spawnSync("sh", ["-c", "command -v chromium || command -v chromium-browser"], { encoding: "utf8" });
  const path = found.stdout.trim().split("\n")[0] ?? "";
  if (found.status !== 0 || path === "") throw new Error(CHROMIUM_MISSING);
  return path;
}
