import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { stringify } from "yaml";
import { runCli } from "../../src/cli/main.js";
import { CYCLES_CSV_COLUMNS } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { memoryIo } from "../helpers/memoryIo.js";

// In-process runs of `heatledger simulate` with the stress keys of a part (ratings, lifetime,
// cycleHysteresis) and the profile's occursPerYear, on invented profiles. Every rating table and
// lifetime parameter below is invented for the test.

/** One RC stage: R = 1 K/W, tau = 0.5 s (the part's only network). */
const NET = "form: foster\nstages:\n  - { r: 1 K/W, tau: 0.5 s }\n";

interface Pulses {
  /** power of each 1 s pulse [W] */
  readonly powerW: number;
  /** pulses per repetition of the block */
  readonly pulses: number;
  /** repetitions of the whole block (back to back) */
  readonly blocks?: number;
  readonly stressKeys?: string;
  readonly top?: string;
}

// Each pulse is 1 s of constant power followed by 29 s without (60 time constants: the part is
// back at ambient to within e^−58 ≈ 6e-26 of the rise before the next pulse).
const PROFILE = (p: Pulses) => `name: pulses
ambient: 25 degC
${p.top ?? ""}
parts:
  - id: r
    network: net.yaml
    limits: { maxTemperature: 150 degC, margin: 10 K }
${p.stressKeys ?? ""}
events:
  - repeat:
      count: ${p.blocks ?? 1}
      events:
        - repeat:
            count: ${p.pulses}
            period: 30 s
            events:
              - power-trace: { part: r, points: [[0, ${p.powerW}], [1 s, ${p.powerW}], [1.000000001 s, 0]] }
`;

function files(p: Pulses): Record<string, string> {
  return { "dir/p.yaml": PROFILE(p), "dir/net.yaml": NET };
}

interface StressJsonView {
  verdict: string;
  temperatureVerdict: string;
  ratingStatus: string;
  occursPerYear: number | null;
  parts: {
    verdict: string;
    stress: {
      ratingStatus: string;
      ratingChecks: { index: number; status: string; pulseEnergy: { energyJ: number; equivalentDurationS: number; ratedEnergyJ: number | null; utilisation: number | null } | null }[];
      cycles: { fullCycles: number; halfCycles: number; largestRangeK: number; mode: string };
      damage: { model: string; perRepetition: number; repetitionsToEndOfLife: number | null; yearsToEndOfLife: number | null; cyclesCounted: number } | null;
      notes: string[];
    };
  }[];
}

async function runJson(p: Pulses, extra: string[] = []): Promise<{ status: number; json: StressJsonView; io: ReturnType<typeof memoryIo> }> {
  const io = memoryIo(files(p));
  const status = await runCli(["simulate", "dir/p.yaml", "--json", ...extra], io);
  expect(io.stderr.join("")).toBe("");
  return { status, json: JSON.parse(io.stdout.join("")) as StressJsonView, io };
}

// A single RC stage heated by P for t = 1 s from ambient rises by P·R·(1 − e^(−t/tau)) (lumped
// capacitance: Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.1 and
// §5.3), then
// cools back to ambient: one closed temperature cycle per pulse, range ΔT = P·R·(1 − e^(−2)).
const rangeOf = (powerW: number) => powerW * 1 * (1 - Math.exp(-2));

const COFFIN = (n: number) => `    lifetime: { model: coffin-manson, referenceCycles: 10000, referenceRange: 50 K, exponent: ${n} }`;

describe("simulate with the stress layer (in process)", () => {
  // Coffin-Manson N_f = N_ref·(ΔT_ref/ΔT)^n (Coffin 1954, Manson 1953, as in src/stress/coffinManson.ts)
  // and Miner's rule D = Σ n_i/N_f,i (Miner, J. Appl. Mech. 12 (1945) A159). 60 W pulses:
  // ΔT = 60·0.864665 = 51.880 K; with N_ref = 1e4 at 50 K and n = 4: N_f = 1e4·(50/51.880)^4 =
  // 8626.8; five pulses per repetition: D = 5/8626.8 = 5.796e-4. The cycle range is the peak
  // rise, found exactly by the engine's peak search (1e-9 K), so 1e-7 relative is an honest bound.
  test.each([
    [60, 5, 4],
    [30, 3, 3],
  ])("%d W pulses ×%d: Miner damage is count / Coffin-Manson N_f with n = %d", async (powerW, pulses, n) => {
    const { status, json } = await runJson({ powerW, pulses, stressKeys: COFFIN(n) });
    expect(status).toBe(0);
    const stress = json.parts[0]!.stress;
    expect(stress.cycles.mode).toBe("repeating");
    expect(stress.cycles.fullCycles).toBe(pulses);
    expect(stress.cycles.halfCycles).toBe(0);
    expectClose(stress.cycles.largestRangeK, rangeOf(powerW), { rel: 1e-7 });
    const nf = 1e4 * Math.pow(50 / rangeOf(powerW), n);
    expect(stress.damage!.model).toMatch(/Coffin-Manson/);
    expectClose(stress.damage!.perRepetition, pulses / nf, { rel: 1e-7 });
    expectClose(stress.damage!.repetitionsToEndOfLife!, nf / pulses, { rel: 1e-7 });
    expect(stress.damage!.yearsToEndOfLife).toBeNull();
  });

  // Miner additivity through simulate (Miner 1945): the same block run twice back to back is one
  // history with every cycle twice, so its damage per repetition is exactly twice the block's.
  // The part returns to ambient between pulses (e^−58 of the rise), so both blocks count the same
  // cycles: 1e-9 relative covers the rounding of the sums.
  test("a profile run back to back doubles the damage (Miner's rule is additive)", async () => {
    const once = await runJson({ powerW: 60, pulses: 4, stressKeys: COFFIN(4) });
    const twice = await runJson({ powerW: 60, pulses: 4, blocks: 2, stressKeys: COFFIN(4) });
    expect(twice.json.parts[0]!.stress.cycles.fullCycles).toBe(2 * once.json.parts[0]!.stress.cycles.fullCycles);
    expectClose(twice.json.parts[0]!.stress.damage!.perRepetition, 2 * once.json.parts[0]!.stress.damage!.perRepetition, { rel: 1e-9 });
  });

  // Calendar life = repetitions to end of life / repetitions per year (Miner's rule projection,
  // src/stress/minerDamage.ts). Exact division: 1e-12 relative.
  test("occursPerYear turns repetitions into years", async () => {
    const { json } = await runJson({ powerW: 60, pulses: 5, stressKeys: COFFIN(4), top: "occursPerYear: 250" });
    expect(json.occursPerYear).toBe(250);
    const d = json.parts[0]!.stress.damage!;
    expectClose(d.yearsToEndOfLife!, d.repetitionsToEndOfLife! / 250, { rel: 1e-12 });
  });

  // Pulse-energy rating: a rectangular pulse has E = P·t and P_peak = P, so its equivalent
  // duration E/P_peak is t = 1 s (same energy, same peak power; common practice), where the
  // table has a row: the rated energy is that row exactly (log-log interpolation is exact at rows).
  // 60 W × 1 s = 60 J against a 1 s row of 66.7 J (90 %) passes; of 54.5 J (110 %) fails, which
  // is a secondary check: the temperature verdict (peak 76.9 °C, limit 150 °C) still passes,
  // the top-level verdict and the exit status say fail.
  test.each([
    ["66.7 J", "pass", 0, 60 / 66.7],
    ["54.5 J", "fail", 1, 60 / 54.5],
  ])("a 60 J, 1 s pulse against a 1 s row of %s: %s, exit %d", async (rated, status, exit, use) => {
    const keys = `    ratings: { pulseEnergy: [{ duration: 10 ms, energy: 5 J }, { duration: 1 s, energy: ${rated} }, { duration: 10 s, energy: 400 J }] }`;
    const { status: code, json } = await runJson({ powerW: 60, pulses: 3, stressKeys: keys });
    expect(code).toBe(exit);
    expect(json.temperatureVerdict).toBe("pass");
    expect(json.parts[0]!.verdict).toBe("pass");
    expect(json.verdict).toBe(status);
    expect(json.ratingStatus).toBe(status);
    const checks = json.parts[0]!.stress.ratingChecks;
    expect(checks.map((c) => c.status)).toEqual([status, status, status]);
    const pe = checks[0]!.pulseEnergy!;
    // the trace's last point is 1 ns after 1 s (a linear fall): E = 60 + 60·1e-9/2 J; 1e-8 relative
    expectClose(pe.energyJ, 60, { rel: 1e-8 });
    expectClose(pe.equivalentDurationS, 1, { rel: 1e-8 });
    expectClose(pe.utilisation!, use, { rel: 1e-8 });
  });

  // The same pulse from a hot start: two 60 W, 1 s pulses 1.5 s apart. The second starts 0.5 s
  // after the first ends, at 25 + 60·(1 − e^(−2))·e^(−1) = 44.086 °C (lumped stage, Incropera
  // et al. §5.2, as rangeOf), so its 66.7 J rating (stated from 25 °C, nothing left at the part's
  // 150 °C limit; common practice for resistor pulse ratings) is derated to
  // k = (150 − 44.086)/(150 − 25) = 0.8473: 56.5 J allowed, 60 J fails (106 %) where the cold first
  // pulse passes (90 %). Closed forms against the exact engine: 1e-8 relative covers the trace's
  // 1 ns linear fall (a 1e-9 share of the pulse).
  test("a pulse that passes from ambient fails the same rating from a hot start", async () => {
    const keys = `    ratings: { pulseEnergy: [{ duration: 10 ms, energy: 5 J }, { duration: 1 s, energy: 66.7 J }, { duration: 10 s, energy: 400 J }] }`;
    const io = memoryIo({ "dir/p.yaml": PROFILE({ powerW: 60, pulses: 2, stressKeys: keys }).replace("period: 30 s", "period: 1.5 s"), "dir/net.yaml": NET });
    expect(await runCli(["simulate", "dir/p.yaml", "--json"], io)).toBe(1);
    const checks = (JSON.parse(io.stdout.join("")) as {
      parts: { stress: { ratingChecks: { status: string; startTemperatureC: number; pulseEnergy: { deratingFactor: number; allowedEnergyJ: number; utilisation: number } }[] } }[];
    }).parts[0]!.stress.ratingChecks;
    expect(checks.map((c) => c.status)).toEqual(["pass", "fail"]);
    expect(checks[0]!.startTemperatureC).toBe(25);
    expect(checks[0]!.pulseEnergy.deratingFactor).toBe(1);
    const startC = 25 + 60 * (1 - Math.exp(-2)) * Math.exp(-1);
    const k = (150 - startC) / 125;
    expectClose(checks[1]!.startTemperatureC, startC, { rel: 1e-8 });
    expectClose(checks[1]!.pulseEnergy.deratingFactor, k, { rel: 1e-8 });
    expectClose(checks[1]!.pulseEnergy.allowedEnergyJ, 66.7 * k, { rel: 1e-8 });
    expectClose(checks[1]!.pulseEnergy.utilisation, 60 / (66.7 * k), { rel: 1e-8 });
  });

  test("a pulse shorter than the table is outside it, not checked: verdict warn, exit 0 (1 with --strict)", async () => {
    const keys = `    ratings: { pulseEnergy: [{ duration: 2 s, energy: 100 J }, { duration: 10 s, energy: 400 J }] }`;
    const { status, json } = await runJson({ powerW: 60, pulses: 2, stressKeys: keys });
    expect(status).toBe(0);
    expect(json.ratingStatus).toBe("outside-table");
    expect(json.temperatureVerdict).toBe("pass");
    expect(json.verdict).toBe("warn");
    const io = memoryIo(files({ powerW: 60, pulses: 2, stressKeys: keys }));
    expect(await runCli(["simulate", "dir/p.yaml", "--strict"], io)).toBe(1);
    expect(io.stdout.join("")).toContain("Verdict: warn (an event falls outside a rating table, so it was not checked).");
  });

  test("a part with no lifetime model: damage null in JSON, the text says damage was not assessed", async () => {
    const { json } = await runJson({ powerW: 60, pulses: 2 });
    expect(json.parts[0]!.stress.damage).toBeNull();
    expect(json.parts[0]!.stress.cycles.fullCycles).toBe(2);
    const io = memoryIo(files({ powerW: 60, pulses: 2 }));
    expect(await runCli(["simulate", "dir/p.yaml", "--no-chart"], io)).toBe(0);
    const text = io.stdout.join("");
    expect(text).toContain("Stress — r");
    expect(text).toContain("damage: cycling damage was not assessed (no lifetime model for this part).");
    expect(text.indexOf("Stress — r")).toBeLessThan(text.indexOf("Verdict:"));
    expect(text).not.toMatch(/NaN/);
  });

  test("--cycles writes one row per counted cycle with its damage, and refuses to overwrite without --force", async () => {
    const p: Pulses = { powerW: 60, pulses: 3, stressKeys: COFFIN(4) };
    const io = memoryIo({ ...files(p), "cycles.csv": "old" });
    expect(await runCli(["simulate", "dir/p.yaml", "--cycles", "cycles.csv"], io)).toBe(2);
    expect(io.stderr.join("")).toContain("cycles.csv: --cycles: expected a path that does not exist yet (or add --force to overwrite), found an existing file");
    expect(io.files["cycles.csv"]).toBe("old");
    expect(await runCli(["simulate", "dir/p.yaml", "--cycles", "cycles.csv", "--force"], io)).toBe(0);
    const lines = io.files["cycles.csv"]!.trim().split("\n");
    expect(lines[0]).toBe(CYCLES_CSV_COLUMNS.join(","));
    expect(lines.length).toBe(1 + 3);
    const nf = 1e4 * Math.pow(50 / rangeOf(60), 4);
    for (const line of lines.slice(1)) {
      const cells = line.split(",");
      expect(cells[0]).toBe("r");
      expectClose(Number(cells[2]), rangeOf(60), { rel: 1e-7 }); // range_K, as above
      expect(Number(cells[6])).toBe(1); // count
      expectClose(Number(cells[9]), 1 / nf, { rel: 1e-7 }); // damage
    }
    expect(io.stdout.join("")).toContain("Cycles: 3 rows written to cycles.csv");
  });

  test("--help states that a failed rating table also exits 1", async () => {
    const io = memoryIo({});
    await runCli(["simulate", "--help"], io);
    const help = io.stdout.join("");
    expect(help).toContain("--cycles <file>");
    expect(help).toContain("an event that exceeds a\npart's rating table (pulse energy or SOA");
    expect(help).toContain("fail   a peak above its limit: exit status 1");
  });
});

describe("a short pulse after hours at ambient (heating time)", () => {
  // Invented: one RC stage (R = 1 K/W, tau = 0.1 s) at 40 °C, a 100 W, 0.3 s pulse every 3 h after
  // 3 h of waiting. Between pulses the part is back at 40 °C exactly, so each pulse rises from a
  // flat stretch hours long; each rise heats for the 0.3 s of its pulse (lumped stage: Incropera
  // et al., Fundamentals of Heat and Mass Transfer, 7th ed., §5.2, peak at the pulse end).
  const profile = `name: short pulses after hours idle
ambient: 40 degC
parts:
  - id: q
    network: { form: foster, stages: [{ r: 1 K/W, tau: 100 ms }] }
    limits: { maxTemperature: 175 degC }
    lifetime: { model: cips2008, currentPerWire: 10 A, voltageClass: 600 V, wireDiameter: 300 um }
events:
  - wait: 3 h
  - repeat:
      count: 4
      period: 3 h
      events:
        - power-trace: { part: q, points: [[0, 100], [0.3 s, 100], [0.300000001 s, 0]] }
`;

  test("JSON: the cycles heat for 0.3 s, and their heating time is reported as outside CIPS 2008's 1-15 s", async () => {
    const io = memoryIo({ "dir/q.yaml": profile });
    expect(await runCli(["simulate", "dir/q.yaml", "--json"], io)).toBe(0);
    const damage = (
      JSON.parse(io.stdout.join("")) as {
        parts: { stress: { damage: { topCycles: { heatingTimeS: number; count: number }[]; extrapolated: { quantity: string; range: number[]; found: number[]; cycles: number; damageShare: number }[] } } }[];
      }
    ).parts[0]!.stress.damage;
    expect(damage.topCycles.map((c) => c.count)).toEqual([1, 1, 1, 1]);
    // the pulse is 0.3 s plus the 1 ns fall of the trace, during which power still exceeds the
    // rise·1/R for 0.05 ns: 1e-9 s covers it and the rounding of times near 5e4 s
    for (const c of damage.topCycles) expectClose(c.heatingTimeS, 0.3, { abs: 1e-9 });
    const short = damage.extrapolated.find((x) => x.quantity === "heatingTime")!;
    expect([short.range, short.cycles]).toEqual([[1, 15], 4]);
    expectClose(short.damageShare, 1, { rel: 1e-12 }); // every cycle outside: the same terms summed twice
  });

  test("text: the cycles list says heating 0.3 s and an extrapolated line names the heating time", async () => {
    const io = memoryIo({ "dir/q.yaml": profile });
    expect(await runCli(["simulate", "dir/q.yaml", "--no-chart"], io)).toBe(0);
    const text = io.stdout.join("");
    expect(text).toMatch(/95 K \(40 to 135 °C, heating 0\.3 s\) ×4/);
    const section = text.slice(text.indexOf("Stress — q"), text.indexOf("Rating checks"));
    expect(section.replace(/\s+/g, " ")).toContain(
      "extrapolated: 4 of 4 counted cycles have a heating time of 0.3-0.3 s, outside the model's validity range 1-15 s (Bayerer et al. 2008, from memory); they carry 100 % of the damage",
    );
    for (const line of section.split("\n")) expect(line.length).toBeLessThanOrEqual(100);
  });
});

describe("bad stress keys in a profile: file:line, field, expected, found", () => {
  // Each message is pinned in full; the line is the line of the offending key in the profile
  // (line 3 of PROFILE holds the optional top-level keys, line 4 `parts:`, so the stress keys sit on line 8).
  test.each([
    [
      "a pulse-energy table whose durations do not increase",
      "    ratings: { pulseEnergy: [{ duration: 1 s, energy: 50 J }, { duration: 10 ms, energy: 5 J }] }",
      "dir/p.yaml:8: parts[0].ratings.pulseEnergy[1].duration: expected durations in increasing order (greater than 1 s of row 0), found 0.01 s",
    ],
    [
      "an SOA boundary whose voltages do not increase",
      "    ratings: { soa: [{ duration: 1 s, points: [{ vds: 100 V, id: 1 A }, { vds: 10 V, id: 5 A }] }] }",
      "dir/p.yaml:8: parts[0].ratings.soa[0].points[1].vds: expected voltages in increasing order (greater than 100 V), found 10 V",
    ],
    [
      "a negative Coffin-Manson exponent",
      COFFIN(-2),
      "dir/p.yaml:8: parts[0].lifetime.exponent: expected an exponent n > 0 (life falls as the range grows), found -2",
    ],
    [
      "a lifetime model with a parameter missing",
      "    lifetime: { model: coffin-manson, referenceCycles: 10000, exponent: 4 }",
      "dir/p.yaml:8: parts[0].lifetime.referenceRange: expected a number in SI units or a string with a unit (such as \"10 ms\"), found nothing",
    ],
    [
      "a misspelt rating key",
      "    ratings: { pulseEnergies: [] }",
      'dir/p.yaml:8: parts[0].ratings.pulseEnergies: expected one of the keys pulseEnergy, soa, soaDerating, pulseEnergyDerating, pulsePower, energyPerOhm, resistance, series, repetitive, voltage, continuousPower, adiabatic (did you mean "pulseEnergy"?), found an unknown key',
    ],
    [
      "a hysteresis in the wrong unit",
      "    cycleHysteresis: 2 s",
      'dir/p.yaml:8: parts[0].cycleHysteresis: expected a temperature difference such as "10 K" (or a number in K), found "2 s" (a time)',
    ],
  ])("%s", async (_what, keys, message) => {
    const io = memoryIo(files({ powerW: 60, pulses: 2, stressKeys: keys }));
    expect(await runCli(["simulate", "dir/p.yaml"], io)).toBe(2);
    const err = io.stderr.join("");
    expect(err).toContain(message);
    expect(err).not.toMatch(/\n\s+at /);
  });

  test("a resistor may take only Coffin-Manson", async () => {
    const text = `name: r
ambient: 25 degC
parts:
  - id: r
    role: resistor
    network: net.yaml
    limits: { maxTemperature: 150 degC }
    lifetime: { model: lesit }
circuit:
  topology: series-resistor
  busVoltage: 48 V
  capacitance: 1 mF
  resistance: 10 ohm
  completion: { fraction: 0.9, timeout: 1 s }
  discharge: { kind: bleeder, resistance: 10 kohm }
events:
  - power-up: {}
`;
    const io = memoryIo({ "dir/p.yaml": text, "dir/net.yaml": NET });
    expect(await runCli(["simulate", "dir/p.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toContain(
      'dir/p.yaml:8: parts[0].lifetime.model: expected "coffin-manson" with your own parameters, or no lifetime key (no cycling model is published for resistors), found "lesit"',
    );
  });

  test("occursPerYear must be a positive number", async () => {
    const io = memoryIo(files({ powerW: 60, pulses: 2, top: "occursPerYear: -3" }));
    expect(await runCli(["simulate", "dir/p.yaml"], io)).toBe(2);
    expect(io.stderr.join("")).toContain("dir/p.yaml:3: occursPerYear: expected a number of times per year > 0 such as 52, found -3");
  });
});

describe("garbled stress keys never escape as anything but a clear input error", () => {
  // fast-check (fixed seed): random values in every stress slot of a valid profile. Each run ends
  // in a report (exit 0 or 1) with no NaN, or in input errors (exit 2) with one
  // `file:line: field: expected ..., found ...` line per problem and no stack trace.
  const garbage = fc.oneof(
    fc.constantFrom<unknown>(null, true, "", "abc", "12 parsecs", "-5 s", "1e400 J", "dc", [], {}, [1, 2], 0, -1, 1e300, 5e-324, "3 K", "10 ms", "2 A", "400 V"),
    fc.double({ noNaN: true }),
    fc.string({ maxLength: 6 }),
  );
  test("random ratings, lifetime and hysteresis values", async () => {
    await fc.assert(
      fc.asyncProperty(garbage, garbage, garbage, garbage, garbage, garbage, async (d1, e1, d2, e2, cycles, hyst) => {
        const keys = stringify({
          ratings: { pulseEnergy: [{ duration: d1, energy: e1 }, { duration: d2, energy: e2 }] },
          lifetime: { model: "coffin-manson", referenceCycles: cycles, referenceRange: "50 K", exponent: 4 },
          cycleHysteresis: hyst,
        })
          .trimEnd()
          .split("\n")
          .map((l) => `    ${l}`)
          .join("\n");
        const io = memoryIo(files({ powerW: 60, pulses: 2, stressKeys: keys }));
        const status = await runCli(["simulate", "dir/p.yaml", "--json"], io);
        const err = io.stderr.join("");
        expect(err).not.toMatch(/\n\s+at /);
        if (status === 2) {
          for (const line of err.trim().split("\n")) expect(line).toMatch(/^heatledger: dir\/p\.yaml:\d+: parts\[0\]\.\S+: expected .+, found .+$/);
        } else {
          expect([0, 1]).toContain(status);
          expect(io.stdout.join("")).not.toMatch(/NaN/);
        }
      }),
      { numRuns: 150, seed: 20261202 },
    );
  });
});
