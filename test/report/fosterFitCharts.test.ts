import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { type FosterFit, fitRelativeErrors, fosterFitCharts } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";

// The fit charts of `network fit --report`: the residual drawn at each point is the relative
// error of the network there, checked against a closed form.

const network = { kind: "foster" as const, stages: [{ rKPerW: 0.2, tauS: 0.01 }, { rKPerW: 0.5, tauS: 1 }] };
// Foster network step response Z(t) = Σ R_i·(1 − e^(−t/τ_i)): each stage is a lumped RC heated
// from rest (Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed., §5.3), summed by
// superposition (Oppenheim & Willsky, Signals and Systems, 2nd ed., §2.2).
const exact = (t: number): number => 0.2 * (1 - Math.exp(-t / 0.01)) + 0.5 * (1 - Math.exp(-t / 1));

describe("fosterFitCharts", () => {
  test("each residual is −δ/(1 + δ) for data read δ too high, and the band is the largest", () => {
    const deltas = [0.01, -0.02, 0, 0.05, -0.01, 0.002, 0.03, -0.04];
    const points = deltas.map((d, i) => ({ timeS: 1e-3 * 10 ** (i / 2), zthKPerW: exact(1e-3 * 10 ** (i / 2)) * (1 + d) }));
    const fit = { network, errors: fitRelativeErrors(network, points), warnings: [], pointCount: points.length } as unknown as FosterFit;
    const [zth, residuals] = fosterFitCharts(fit, points);
    const layers = (residuals!.spec as { layer: { data: { values: Record<string, number>[] } }[] }).layer;
    const drawn = layers[2]!.data.values;
    expect(drawn.map((v) => v.timeS)).toEqual(points.map((p) => p.timeS));
    drawn.forEach((v, i) => expect(v.errorPercent!).toBeCloseTo((-deltas[i]! / (1 + deltas[i]!)) * 100, 9));
    const band = layers[1]!.data.values.map((v) => v.y!);
    expect(band[0]).toBeCloseTo(Math.max(...deltas.map((d) => Math.abs(d / (1 + d)))) * 100, 9);
    expect(band[1]).toBe(-band[0]!);
    // the Zth chart holds the data points as given and the curve of the network
    const zthLayers = (zth!.spec as { layer: { data: { values: { timeS: number; zthKPerW: number }[] } }[] }).layer;
    expect(zthLayers[1]!.data.values.map((v) => v.zthKPerW)).toEqual(points.map((p) => p.zthKPerW));
    for (const v of zthLayers[0]!.data.values) expect(v.zthKPerW).toBeCloseTo(exact(v.timeS), 12);
  });

  test("network fit --report writes both charts as inline SVG; --svg the Zth chart; refused without --force", async () => {
    const csv = readFileSync(join(import.meta.dirname, "..", "..", "profiles", "networks", "example-zth.csv"), "utf8");
    const io = memoryIo({ "zth.csv": csv });
    expect(await runCli(["network", "fit", "zth.csv", "--report", "fit.html", "--svg", "fit.svg"], io), io.stderr.join("")).toBe(0);
    const page = io.files["fit.html"]!;
    expect(page.match(/<svg/g)?.length).toBe(2);
    expect(page).toContain("Fit residuals");
    expect(page).toContain("relative error [%]");
    expect(page).not.toMatch(/<script|(?:src|href)="https?:/);
    expect(io.files["fit.svg"]).toMatch(/^<svg/);
    expect(io.stdout.join("")).toContain("Report: 2 charts written to fit.html");
    const again = memoryIo({ "zth.csv": csv, "fit.html": "mine" });
    expect(await runCli(["network", "fit", "zth.csv", "--report", "fit.html"], again)).toBe(2);
    expect(again.files["fit.html"]).toBe("mine");
    expect(again.stderr.join("")).toContain("--report: expected a path that does not exist yet");
  });
});
