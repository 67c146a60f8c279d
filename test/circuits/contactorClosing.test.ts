import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, test } from "vitest";
import { contactorClosing } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { requireNgspiceRan } from "../helpers/requireNgspice.js";
import { inputErrorMessage } from "./inputErrorMessage.js";

const C = 3.3e-3;

describe("contactor closing current", () => {
  // No inductance: the loop is an RC circuit, i = (ΔV/R)·e^(−t/RC), peak ΔV/R at once, and the loop
  // dissipates C·ΔV²/2 (Hayt, Kemmerly & Durbin, 8th ed. (2012), §8.8 and §7.1, from memory).
  test("a resistive loop closes with ΔV/R and C·ΔV²/2", () => {
    const dv = (1 - 0.92) * 84;
    const c = contactorClosing({ makingCurrentA: 300, loopResistanceOhm: 0.03 }, C, dv);
    expect(c.loop).toBe("resistive");
    expectClose(c.peakCurrentA, dv / 0.03, { rel: 1e-15 });
    expectClose(c.energyJ, 0.5 * C * dv * dv, { rel: 1e-15 });
    expectClose(c.ratingRatio, dv / 0.03 / 300, { rel: 1e-15 });
  });

  // Underdamped series RLC with the capacitor ΔV short of the source (Hayt et al., §9.5 and §9.6,
  // from memory): i(t) = ΔV/(ωd·L)·e^(−αt)·sin(ωd·t). The peak is found here by a dense scan of that
  // textbook solution, independent of the closed-form peak time the model uses.
  test("an underdamped loop: the peak of the textbook solution i = ΔV/(ωd·L)·e^(−αt)·sin(ωd·t)", () => {
    const dv = 6.72;
    const r = 0.01;
    const l = 2e-6;
    const alpha = r / (2 * l);
    const wd = Math.sqrt(1 / (l * C) - alpha * alpha);
    let best = 0;
    let bestT = 0;
    const n = 200_000;
    const span = Math.PI / wd;
    for (let k = 0; k <= n; k++) {
      const t = (k / n) * span;
      const i = (dv / (wd * l)) * Math.exp(-alpha * t) * Math.sin(wd * t);
      if (i > best) [best, bestT] = [i, t];
    }
    const c = contactorClosing({ makingCurrentA: 300, loopResistanceOhm: r, loopInductanceH: l }, C, dv);
    expect(c.loop).toBe("underdamped");
    expectClose(c.peakCurrentA, best, { rel: 1e-9 }); // the scan's grid error at the flat top is O(step²)
    expectClose(c.peakTimeS, bestT, { abs: 2 * (span / n) });
    // it rings: the peak is far below ΔV/R
    expect(c.peakCurrentA).toBeLessThan(dv / r);
  });

  // Overdamped and critically damped: i = ΔV/(L(s1 − s2))·(e^(s1 t) − e^(s2 t)) and (ΔV/L)·t·e^(−αt)
  // (Hayt et al., §9.6, from memory), peaks by the same dense scan.
  test.each([
    { name: "overdamped", r: 0.2, l: 2e-6 },
    { name: "critically damped", r: 2 * Math.sqrt(2e-6 / C), l: 2e-6 },
  ])("a $name loop: the peak of the textbook solution", ({ name, r, l }) => {
    const dv = 10;
    const alpha = r / (2 * l);
    const w0sq = 1 / (l * C);
    const disc = alpha * alpha - w0sq;
    const current = (t: number): number => {
      if (disc > 1e-9 * alpha * alpha) {
        const s1 = -alpha + Math.sqrt(disc);
        const s2 = -alpha - Math.sqrt(disc);
        return (dv / (l * (s1 - s2))) * (Math.exp(s1 * t) - Math.exp(s2 * t));
      }
      return (dv / l) * t * Math.exp(-alpha * t);
    };
    let best = 0;
    const n = 200_000;
    for (let k = 0; k <= n; k++) best = Math.max(best, current((k / n) * (20 / alpha)));
    const c = contactorClosing({ makingCurrentA: 300, loopResistanceOhm: r, loopInductanceH: l }, C, dv);
    expect(c.loop).toBe(name);
    expectClose(c.peakCurrentA, best, { rel: 1e-7 });
  });

  test("bad values are refused naming the field", () => {
    expect(inputErrorMessage(() => contactorClosing({ makingCurrentA: 0, loopResistanceOhm: 1 }, C, 5))).toContain("contactor.makingCurrent");
    expect(inputErrorMessage(() => contactorClosing({ makingCurrentA: 10, loopResistanceOhm: 1, loopInductanceH: -1 }, C, 5))).toContain("contactor.loopInductance");
  });
});

// Outside reference: ngspice (Debian package `ngspice`, installed by .ci/run) runs the closing
// loop as a netlist: a source, the loop resistance and inductance, the capacitor starting ΔV below
// the source. Its largest inductor current must match the closed-form peak; the largest step (0.1 µs
// on a ring of about 0.5 ms: the sampled top is low by about (ω·h)²/2 ≈ 1e-6) and reltol 1e-7 bound
// the sampled peak's error well below 1e-4.
const work = mkdtempSync(join(tmpdir(), "heatledger-contactor-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe("contactor closing current against ngspice", () => {
  test("an underdamped loop: the peak closing current within 1e-4", () => {
    const vs = 84;
    const dv = 6.72;
    const r = 0.01;
    const l = 2e-6;
    const tstop = 3e-4;
    writeFileSync(
      join(work, "close.cir"),
      `* contactor closing onto a bus dv below the source
v1 src 0 dc ${vs}
r1 src a ${r}
l1 a bus ${l} ic=0
c1 bus 0 ${C} ic=${vs - dv}
.options reltol=1e-7 abstol=1e-12 vntol=1e-9
.tran 1e-7 ${tstop} 0 1e-7 uic
.control
set filetype=ascii
set wr_singlescale
set wr_vecnames
run
wrdata close.dat i(l1)
.endc
.end
`,
    );
    const run = spawnSync("ngspice", ["-b", "close.cir"], { cwd: work, encoding: "utf8" });
    requireNgspiceRan(run);
    expect(`${run.stdout}${run.stderr}`).not.toMatch(/error|abort|too small|singular/i);
    const [head, ...rows] = readFileSync(join(work, "close.dat"), "utf8").trim().split("\n");
    expect(head!.trim().split(/\s+/)).toHaveLength(2);
    const samples = rows.map((row) => row.trim().split(/\s+/).map(Number));
    expect(samples.at(-1)![0]).toBeCloseTo(tstop, 12);
    const spicePeak = samples.reduce((m, s) => Math.max(m, Math.abs(s[1]!)), 0);
    const c = contactorClosing({ makingCurrentA: 300, loopResistanceOhm: r, loopInductanceH: l }, C, dv);
    expectClose(c.peakCurrentA, spicePeak, { rel: 1e-4 });
  });
});
