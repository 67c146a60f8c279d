import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { type FosterNetwork, constantPowerSegment, fosterToModal, logSpacedTimes, networkToModal, parseNetwork, parseStructuredText, runThermalHistory, traceSteps, zth } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { memoryIo } from "../helpers/memoryIo.js";

const root = fileURLToPath(new URL("../..", import.meta.url));
const EXAMPLE = readFileSync(`${root}profiles/networks/example-zth.csv`, "utf8");
// The invented network the example file was generated from (then rounded to 3 significant digits).
const EXAMPLE_NETWORK: FosterNetwork = {
  kind: "foster",
  stages: [
    { rKPerW: 0.02, tauS: 50e-6 },
    { rKPerW: 0.08, tauS: 1e-3 },
    { rKPerW: 0.15, tauS: 12e-3 },
    { rKPerW: 0.25, tauS: 0.15 },
  ],
};

async function run(args: string[], files: Record<string, string>) {
  const io = memoryIo(files);
  const status = await runCli(args, io);
  return { status, out: io.stdout.join(""), err: io.stderr.join(""), files: io.files };
}

describe("heatledger network fit", () => {
  test("network fit on the bundled example reports stages, errors, the chosen count, a chart and the caution", async () => {
    const r = await run(["network", "fit", "zth.csv"], { "zth.csv": EXAMPLE });
    expect(r.status).toBe(0);
    expect(r.out).toContain("Foster network: 4 stages chosen by BIC among 1 to 6 tried");
    expect(r.out).toMatch(/max relative error [0-9.]+ % \(at [^)]+\), RMS [0-9.]+ %/);
    expect(r.out).toContain("time axis: logarithmic");
    expect(r.out).toContain("curve 2 (*): fitted Foster network [K/W]");
    expect(r.out).toContain("Network file (no --out given");
    expect(r.out).toContain("Caution: these results are only as good as the thermal network");
  });

  test("network fit --json gives a network that reproduces the generating network's Zth", async () => {
    const r = await run(["network", "fit", "zth.csv", "--json"], { "zth.csv": EXAMPLE });
    expect(r.status).toBe(0);
    const json = JSON.parse(r.out) as { network: unknown; pointCount: number; errors: { maxRelativeError: number } };
    expect(json.pointCount).toBe(26);
    // the points carry 3 significant digits, a read-off error of at most 0.5/100 relative at the
    // smallest mantissa; the fit stays inside it (measured 0.34 %)
    expect(json.errors.maxRelativeError).toBeLessThan(0.005);
    const fitted = networkToModal(parseNetwork(json.network));
    const known = fosterToModal(EXAMPLE_NETWORK);
    // against the unrounded generating network: the same 0.5 % read-off bound (measured 0.11 %)
    for (const t of logSpacedTimes(1e-5, 1, 60)) expectClose(zth(fitted, t), zth(known, t), { rel: 0.005 });
  });

  test("network fit --out writes a network file that parseNetwork reads, and refuses to overwrite without --force", async () => {
    const files = { "zth.csv": EXAMPLE };
    const first = await run(["network", "fit", "zth.csv", "--out", "part.yaml", "--name", "example MOSFET"], files);
    expect(first.status).toBe(0);
    expect(first.out).toContain("Wrote part.yaml");
    const network = parseNetwork(parseStructuredText(files["part.yaml" as keyof typeof files]!, "part.yaml").data);
    expect(network.kind).toBe("foster");
    const again = await run(["network", "fit", "zth.csv", "--out", "part.yaml"], first.files);
    expect(again.status).toBe(2);
    expect(again.err).toBe("heatledger: part.yaml: --out: expected a path that does not exist yet (or add --force to overwrite), found an existing file\n");
    expect((await run(["network", "fit", "zth.csv", "--out", "part.yaml", "--force"], first.files)).status).toBe(0);
  });

  test("network fit reads units from options when the header has none, and asks for them otherwise", async () => {
    const bare = "time, zth\n" + EXAMPLE.split("\n").slice(4).join("\n");
    const missing = await run(["network", "fit", "bare.csv"], { "bare.csv": bare });
    expect(missing.status).toBe(2);
    expect(missing.err).toBe('heatledger: bare.csv:1: time: expected a unit for the time column, in the header ("time [ms]") or as --time-unit, found "time"\n');
    const given = await run(["network", "fit", "bare.csv", "--time-unit", "ms", "--zth-unit", "K/W", "--json"], { "bare.csv": bare });
    expect(given.status).toBe(0);
    expect((JSON.parse(given.out) as { pointCount: number }).pointCount).toBe(26);
  });

  test.each([
    ["a cell that is not a number", "time [s], Zth [K/W]\n0.001, 0.1\n0.01, abc\n0.1, 0.5\n", [], 'heatledger: p.csv:3: zth: expected a number (in K/W), found "abc"\n'],
    ["times not increasing", "time [s], Zth [K/W]\n0.001, 0.1\n0.01, 0.2\n0.01, 0.3\n0.1, 0.5\n", [], "heatledger: p.csv:4: points[2].time: expected a time later than the previous point's 0.01 s (times must increase strictly), found 0.01\n"],
    ["a negative Zth", "time [s], Zth [K/W]\n0.001, 0.1\n0.01, -0.2\n0.1, 0.5\n", [], "heatledger: p.csv:3: points[1].zth: expected a thermal impedance > 0 K/W, found -0.2\n"],
    ["fewer points than stages", "time [s], Zth [K/W]\n0.001, 0.1\n0.01, 0.2\n0.1, 0.5\n", ["--stages", "2"], "heatledger: p.csv: points: expected at least 5 Zth points to fit 2 stages (two parameters per stage, plus one), found 3 points\n"],
    ["a bad --criterion", "time [s], Zth [K/W]\n0.001, 0.1\n0.01, 0.2\n0.1, 0.5\n", ["--criterion", "aic"], 'heatledger: --criterion: expected one of bic, aicc, found "aic"\n'],
    ["a wrong unit", "time [K], Zth [K/W]\n0.001, 0.1\n0.01, 0.2\n0.1, 0.5\n", [], 'heatledger: p.csv:1: time unit: expected a unit of a time such as "350 ms" (or a number in s), found "K"\n'],
  ])("network fit rejects %s with exit 2 and one clear line", async (_, text, extra, message) => {
    const r = await run(["network", "fit", "p.csv", ...extra], { "p.csv": text });
    expect(r.err).toBe(message);
    expect(r.status).toBe(2);
  });

  test("network fit --help teaches the file format, the method and examples", async () => {
    const r = await run(["network", "fit", "--help"], {});
    expect(r.status).toBe(0);
    expect(r.out).toContain("time [ms], Zth [K/W]");
    expect(r.out).toContain("How the fit works");
    expect(r.out).toContain("--stages <n>");
    expect(r.out).toContain("heatledger network fit profiles/networks/example-zth.csv");
  });
});

describe("heatledger network from-rating", () => {
  // A rating table made from a known network by the exact engine, as in
  // test/thermal/zthFromPulseRating.test.ts: E_max = ΔT·t_p / peak_rise(1 W pulse of t_p).
  const known: FosterNetwork = { kind: "foster", stages: [{ rKPerW: 0.35, tauS: 0.04 }, { rKPerW: 0.9, tauS: 1.8 }, { rKPerW: 1.6, tauS: 45 }] };
  const model = fosterToModal(known);
  const durations = logSpacedTimes(1e-3, 500, 17);
  const rows = durations.map((tp) => {
    const peak = runThermalHistory(model, traceSteps([[constantPowerSegment(0, tp, 1)]], 0, 2 * tp)).peakRiseK[0]!;
    return `${tp * 1000}, ${(325 / peak) * tp}`;
  });
  const table = `duration [ms], energy [J]\n${rows.join("\n")}\n`;

  test("network from-rating converts the table, fits it and lists the assumptions", async () => {
    const r = await run(["network", "from-rating", "rating.csv", "--start-temperature", "25 degC", "--max-temperature", "350 degC", "--json"], { "rating.csv": table });
    expect(r.status).toBe(0);
    const json = JSON.parse(r.out) as { allowedRiseK: number; assumptions: string[]; zthPoints: { timeS: number; zthKPerW: number }[]; network: unknown };
    expect(json.allowedRiseK).toBe(325);
    expect(json.assumptions.length).toBe(5);
    // conversion inverts the generation: the CSV's shortest-round-trip number text is exact, the
    // ms → s scaling and ΔT·t_p/E round a few times; measured 2.2e-16 (one ulp) at worst when the
    // tolerance was set, so 1e-15
    json.zthPoints.forEach((p) => expectClose(p.zthKPerW, zth(model, p.timeS), { rel: 1e-15 }));
    const fitted = networkToModal(parseNetwork(json.network));
    // exact data: the network file keeps 10 significant digits, at most 5e-10 relative per value
    // and so at most 1e-9 on Zth (an R and a tau each rounded); measured 0 at all 50 times, since
    // the fit lands within that rounding of the generating network's short decimals
    for (const t of logSpacedTimes(1e-3, 500, 50)) expectClose(zth(fitted, t), zth(model, t), { rel: 1e-9 });
  });

  test("network from-rating on the bundled example table gives back the bundled wirewound network it was made from", async () => {
    // profiles/networks/example-pulse-rating.csv was generated from
    // profiles/networks/wirewound-resistor-foster.yaml (E_max = 325 K·t_p/Zth(t_p)) and rounded to
    // 3 significant digits: a read-off error up to 0.5 % per row, which bounds the Zth gap
    // (measured 0.15 %).
    const r = await run(["network", "from-rating", "rating.csv", "--start-temperature", "25 degC", "--max-temperature", "350 degC", "--json"], {
      "rating.csv": readFileSync(`${root}profiles/networks/example-pulse-rating.csv`, "utf8"),
    });
    expect(r.status).toBe(0);
    const fitted = networkToModal(parseNetwork((JSON.parse(r.out) as { network: unknown }).network));
    const bundled = networkToModal(parseNetwork(parseStructuredText(readFileSync(`${root}profiles/networks/wirewound-resistor-foster.yaml`, "utf8"), "w.yaml").data));
    for (const t of logSpacedTimes(1e-3, 1000, 60)) expectClose(zth(fitted, t), zth(bundled, t), { rel: 0.005 });
  });

  test("network from-rating text report states the conversion and its assumptions", async () => {
    const r = await run(["network", "from-rating", "rating.csv", "--start-temperature", "25 degC", "--max-temperature", "350 degC"], { "rating.csv": table });
    expect(r.status).toBe(0);
    expect(r.out).toContain("Zth(t_p) = 325.0 K * t_p / E_max(t_p), assuming:");
    expect(r.out).toContain("rectangular");
    expect(r.out).toContain("Caution:");
  });

  test.each([
    [["--start-temperature", "25 degC"], 'heatledger: --max-temperature: expected the element temperature the rated pulse reaches, such as "350 degC", found nothing\n'],
    [["--start-temperature", "25 degC", "--max-temperature", "20 degC"], "heatledger: --max-temperature: expected a maximum element temperature above the start temperature 25 °C, found 20\n"],
  ])("network from-rating %j exits 2 naming the flag", async (flags, message) => {
    const r = await run(["network", "from-rating", "rating.csv", ...flags], { "rating.csv": table });
    expect(r.err).toBe(message);
    expect(r.status).toBe(2);
  });

  test("network from-rating names the line of a row rated for more power than a shorter pulse", async () => {
    const r = await run(["network", "from-rating", "r.csv", "--start-temperature", "25 degC", "--max-temperature", "350 degC"], {
      "r.csv": "duration [s], energy [J]\n0.1, 10\n0.2, 30\n",
    });
    expect(r.err).toBe("heatledger: r.csv:3: table[1].energy: expected a rated power E/t_p of at most the previous row's 100 W (a longer pulse cannot carry more power), found 30 J in 0.2 s = 150 W\n");
    expect(r.status).toBe(2);
  });
});

describe("heatledger network lumped", () => {
  test("network lumped with one lump gives tau = R·m·c (nichrome preset)", async () => {
    const r = await run(["network", "lumped", "--mass", "3 g", "--material", "nichrome", "--r-ambient", "40 K/W", "--json"], {});
    expect(r.status).toBe(0);
    const json = JSON.parse(r.out) as { foster: { rKPerW: number; tauS: number }[]; network: { form: string } };
    // C = 0.003 kg · 420 J/(kg K) (Incropera 7th ed. Table A.1, from memory) = 1.26 J/K, tau = 40·1.26 s
    expect(json.network.form).toBe("cauer");
    expectClose(json.foster[0]!.tauS, 50.4, { rel: 1e-12 });
    expectClose(json.foster[0]!.rKPerW, 40, { rel: 1e-12 });
  });

  test("network lumped with a body writes a two-stage network, in Foster form when asked", async () => {
    const args = ["network", "lumped", "--mass", "0.5 g", "--material", "nichrome", "--r-body", "2 K/W", "--body-mass", "20 g", "--body-material", "alumina", "--r-ambient", "25 K/W"];
    const r = await run([...args, "--form", "foster", "--out", "lump.yaml"], {});
    expect(r.status).toBe(0);
    expect(r.out).toContain("Lumped network, 2 stages: total Rth = 27.00 K/W");
    expect(r.out).toContain("Material alumina: c = 765 J/(kg K) at 300 K");
    const network = parseNetwork(parseStructuredText(r.files["lump.yaml"]!, "lump.yaml").data);
    expect(network.kind).toBe("foster");
    // Foster and Cauer forms of one network share Zth (exact conversion, JEDEC JESD51-14 annex); 1e-9 is the file's 10 digits
    const cauer = await run([...args, "--json"], {});
    const ladder = networkToModal(parseNetwork((JSON.parse(cauer.out) as { network: unknown }).network));
    for (const t of [0.01, 1, 100, 3000]) expectClose(zth(networkToModal(network), t), zth(ladder, t), { rel: 1e-9 });
  });

  test.each([
    [["--mass", "3 g", "--r-ambient", "40 K/W"], "heatledger: --material: expected a material preset (copper, aluminium, aluminium-2024, brass, steel, stainless-304, nichrome, constantan, nickel, silicon, alumina, silicon-carbide, steatite, ceramic, fr4) or --specific-heat, found nothing\n"],
    [["--mass", "3 g", "--material", "kryptonite", "--r-ambient", "40 K/W"], 'heatledger: --material: expected one of the material presets copper, aluminium, aluminium-2024, brass, steel, stainless-304, nichrome, constantan, nickel, silicon, alumina, silicon-carbide, steatite, ceramic, fr4, found "kryptonite"\n'],
    [["--mass", "3 V", "--material", "copper", "--r-ambient", "40 K/W"], 'heatledger: --mass: expected a mass such as "8 g" (or a number in kg), found "3 V" (a voltage)\n'],
    [["--mass", "3 g", "--material", "copper", "--r-ambient", "40 K/W", "--body-mass", "5 g", "--body-material", "steel"], 'heatledger: --r-body: expected the resistance from the element to the body, such as "2 K/W", found nothing\n'],
  ])("network lumped %j exits 2 with one clear line", async (flags, message) => {
    const r = await run(["network", "lumped", ...flags], {});
    expect(r.err).toBe(message);
    expect(r.status).toBe(2);
  });
});
