/// <reference lib="dom" />
/// <reference lib="dom.iterable" />
import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import puppeteer, { type Browser } from "puppeteer-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { requireChromium } from "../helpers/requireChromium.js";

// The --report pages in a real browser (Debian chromium through puppeteer-core, an outside
// renderer): each page made by the built bin from the bundled profiles opens with no console
// error and no request beyond its own file, shows every chart the command said it wrote as an SVG
// with axes, and the peak marker drawn on the temperature chart carries the peak the --json
// report gives. A screenshot of each page goes to .ci-out/report-screens/.
const root = fileURLToPath(new URL("../..", import.meta.url));
const temp = mkdtempSync(join(tmpdir(), "heatledger-report-"));
const screens = join(root, ".ci-out", "report-screens");
let browser: Browser;

beforeAll(async () => {
  mkdirSync(screens, { recursive: true });
  browser = await puppeteer.launch({ executablePath: requireChromium(), headless: true, args: ["--no-sandbox", "--disable-gpu"] });
});
afterAll(async () => {
  await browser?.close();
  rmSync(temp, { recursive: true, force: true });
});

function heatledger(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, ["bin/heatledger.js", ...args], { cwd: root, encoding: "utf8", maxBuffer: 1 << 30, env: { ...process.env, NO_COLOR: "1" } });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

const bundled = readdirSync(join(root, "profiles")).filter((f) => f.endsWith(".yaml"));
const withSupervision = bundled.filter((f) => /^\s*supervision:/m.test(readFileSync(join(root, "profiles", f), "utf8")));
// every bundled profile through simulate; the planners (seconds each on a shared machine) on one profile each
const runs: [string, string[]][] = [
  ...bundled.map((f): [string, string[]] => [`simulate ${f}`, ["simulate", `profiles/${f}`]]),
  ["retries warehouse-robot-48v.yaml", ["retries", "profiles/warehouse-robot-48v.yaml"]],
  ["size home-storage-400v.yaml", ["size", "profiles/home-storage-400v.yaml"]],
  ...withSupervision.slice(0, 1).map((f): [string, string[]] => [`supervise ${f}`, ["supervise", `profiles/${f}`]]),
  ["replay irrigation log", ["replay", "profiles/logs/irrigation-pump-returned-unit.csv", "--profile", "profiles/irrigation-pump-decade.yaml"]],
];

interface PageFindings {
  errors: string[];
  external: string[];
  charts: { id: string; axes: number; paths: number }[];
  peakLabels: string[];
  scripts: number;
}

async function openReport(file: string, screenshot: string): Promise<PageFindings> {
  const page = await browser.newPage();
  const errors: string[] = [];
  const external: string[] = [];
  const own = pathToFileURL(file).href;
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(String(e)));
  await page.setRequestInterception(true);
  page.on("request", (r) => {
    if (r.url() !== own && !r.url().startsWith("data:")) external.push(r.url());
    void (r.url() === own ? r.continue() : r.abort());
  });
  await page.setViewport({ width: 1100, height: 900 });
  await page.goto(own, { waitUntil: "load" });
  const found = await page.evaluate(() => ({
    charts: [...document.querySelectorAll("section.chart > svg")].map((svg) => ({
      id: svg.id,
      axes: svg.querySelectorAll('[aria-roledescription="axis"]').length,
      paths: svg.querySelectorAll("path").length,
    })),
    peakLabels: [...document.querySelectorAll("#chart-temperature [aria-label^='peak of']")].map((e) => e.getAttribute("aria-label") ?? ""),
    scripts: document.querySelectorAll("script").length,
  }));
  await page.screenshot({ path: screenshot as `${string}.png`, fullPage: true });
  await page.close();
  return { errors, external, ...found };
}

describe("--report pages in headless chromium", () => {
  test.each(runs)("%s", { timeout: 300_000 }, async (name, args) => {
    const slug = name.replace(/[^a-z0-9]+/gi, "-");
    const html = join(temp, `${slug}.html`);
    const run = heatledger(...args, "--report", html);
    expect(run.stderr).not.toMatch(/internal error/);
    expect([0, 1]).toContain(run.status);
    const said = /Report: (\d+) charts written/.exec(run.stdout);
    expect(said).not.toBeNull();
    const page = await openReport(html, join(screens, `${slug}.png`));
    expect(page.errors).toEqual([]);
    expect(page.external).toEqual([]);
    expect(page.scripts).toBe(0);
    expect(page.charts.length).toBe(Number(said![1]));
    for (const chart of page.charts) {
      expect(chart.axes, chart.id).toBeGreaterThanOrEqual(2);
      expect(chart.paths, chart.id).toBeGreaterThan(0);
    }
    if (args[0] === "simulate") {
      // the plotted peak of every part is the peak the JSON report gives
      const json = JSON.parse(heatledger(...args, "--json").stdout) as { parts: { id: string; peakTemperatureC: number }[] };
      expect(page.peakLabels.length).toBe(json.parts.length);
      for (const part of json.parts) {
        const label = page.peakLabels.find((l) => l.startsWith(`peak of ${part.id}:`));
        expect(label, part.id).toBeDefined();
        expect(Number(/: ([-\d.e+]+) °C/.exec(label!)![1])).toBeCloseTo(part.peakTemperatureC, 6);
      }
    }
  });
});
