#!/usr/bin/env node
// Thin launcher: the compiled CLI lives in dist/ (built by `npm ci` through the prepare script).
import { runCli } from "../dist/cli/main.js";

process.exitCode = await runCli(process.argv.slice(2));
