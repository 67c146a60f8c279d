#!/usr/bin/env node
// Thin launcher: the compiled CLI lives in dist/ (built by `npm ci` through the prepare script),
// bundled into dist/bundle/ for a faster start (scripts/bundle-cli.mjs); the unbundled
// dist/cli/main.js serves when the bundle was not built.
import { existsSync } from "node:fs";

const bundled = new URL("../dist/bundle/cli/main.js", import.meta.url);
const { runCli } = await import(existsSync(bundled) ? bundled.href : "../dist/cli/main.js");
process.exitCode = await runCli(process.argv.slice(2));
