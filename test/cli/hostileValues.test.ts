import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { escapeControlCharacters } from "../../src/cli/terminalSafeIo.js";
import { tidyNumbers } from "../../src/errors/tidyNumbers.js";
import { memoryIo } from "../helpers/memoryIo.js";
import { shortedBusProfile, shortedRetry } from "../helpers/shortedBusProfile.js";

// Values built to overflow, to stall a solver or to act on the terminal: each is refused where it
// is written (file, line, key) with exit 2, or shown escaped. Messages are asserted exactly.

async function run(argv: string[], files: Record<string, string>): Promise<{ status: number; out: string; err: string }> {
  const io = memoryIo(files);
  const status = await runCli(argv, io);
  return { status, out: io.stdout.join(""), err: io.stderr.join("") };
}

const simulate = (profile: string) => run(["simulate", "p.yaml"], { "p.yaml": profile });

describe("magnitudes outside the documented range are refused at their line", () => {
  test("resistance: 1e308 ohm", async () => {
    const result = await simulate(shortedBusProfile("  - power-up: {}").replace("resistance: 48 ohm", "resistance: 1e308 ohm"));
    expect(result).toEqual({
      status: 2,
      out: "",
      err: 'heatledger: p.yaml:12: circuit.resistance: expected a resistance such as "47 ohm" (or a number in ohm), zero or between 1e-9 and 1e12 ohm in size, found "1e308 ohm"\n',
    });
  });

  test("r: 1e308 K/W", async () => {
    const result = await simulate(shortedBusProfile("  - power-up: {}").replace("r: 2 K/W", "r: 1e308 K/W"));
    expect(result.err).toBe(
      'heatledger: p.yaml:6: parts[0].network.stages[0].r: expected a thermal resistance such as "2.5 K/W" (or a number in K/W), zero or between 1e-12 and 1e9 K/W in size, found "1e308 K/W"\n',
    );
  });

  test("run: 1e308", async () => {
    const result = await simulate(shortedBusProfile("  - power-up: {}\n  - run: 1e308"));
    expect(result.err).toBe('heatledger: p.yaml:17: events[1].run: expected a time such as "350 ms" (or a number in s), zero or between 1e-12 and 1e12 s in size, found 1e+308\n');
  });

  // the planners read the same profile: each refuses the value at its line before any arithmetic
  // (no "NaN" from an attempt trace, no "Infinity °C"), with exit 2, never 1 or 3
  test.each(["retries", "supervise", "size"])("%s refuses resistance and r of 1e308 and run: 1e308 at their lines", async (command) => {
    const events = shortedRetry("      attempts: 3\n      interval: 2 s\n      lockout: 1 min");
    const cases: [string, string][] = [
      [shortedBusProfile(events).replace("resistance: 48 ohm", "resistance: 1e308 ohm"), "p.yaml:12: circuit.resistance:"],
      [shortedBusProfile(events).replace("r: 2 K/W", "r: 1e308 K/W"), "p.yaml:6: parts[0].network.stages[0].r:"],
      [shortedBusProfile(`${events}\n  - run: 1e308`), "p.yaml:21: events[1].run:"],
    ];
    for (const [profile, where] of cases) {
      const result = await run([command, "p.yaml"], { "p.yaml": profile });
      expect(result.status).toBe(2);
      expect(result.err.startsWith(`heatledger: ${where} expected `)).toBe(true);
      expect(result.out + result.err).not.toMatch(/NaN|Infinity/);
    }
  });

  test("an ambient below absolute zero", async () => {
    const result = await simulate(shortedBusProfile("  - power-up: {}").replace("ambient: 25 degC", "ambient: -300 degC"));
    expect(result.err).toBe('heatledger: p.yaml:2: ambient: expected a temperature such as "40 degC" (or a number in degC), at or above absolute zero (-273.15 degC), found "-300 degC"\n');
  });
});

describe("problems found while a loaded profile runs get the line of their key", () => {
  test("a repeat whose period is shorter than one repetition", async () => {
    const result = await simulate(shortedBusProfile("  - repeat:\n      count: 3\n      period: 0.3 s\n      events:\n        - power-up: {}\n        - run: 0.2 s"));
    expect(result.err).toMatch(/^heatledger: p\.yaml:18: events\[0\]\.repeat\.period: expected a period at least as long as one repetition \(repetition 1 took 0\.\d+ s\), found 0\.3 s\n$/);
  });
});

describe("planner sizes are bounded, naming the limit and how to raise it", () => {
  test("retry attempts of a million", async () => {
    const result = await simulate(shortedBusProfile(shortedRetry("      attempts: 1000000\n      interval: 2 s\n      lockout: 1 min")));
    expect(result.err).toBe(
      "heatledger: p.yaml:17: events[0].retry.attempts: expected a whole number of attempts ≥ 1, at most 10000 (set HEATLEDGER_MAX_PLAN_ATTEMPTS to raise it), found 1000000\n",
    );
  });

  test("map.points of a million, and map from above to, each with the profile's line", async () => {
    const events = shortedRetry("      attempts: 3\n      interval: 2 s\n      lockout: 1 min");
    const points = await run(["retries", "p.yaml"], { "p.yaml": shortedBusProfile(events, "retryPlan:\n  map: { points: 1000000 }\n") });
    expect(points.err).toBe("heatledger: p.yaml:22: retryPlan.map.points: expected a whole number of intervals ≥ 2, at most 1000 (set HEATLEDGER_MAX_MAP_SIDE to raise it), found 1000000\n");
    const order = await run(["retries", "p.yaml"], { "p.yaml": shortedBusProfile(events, "retryPlan:\n  map: { from: 60 s, to: 0.7 s }\n") });
    expect(order.err).toBe("heatledger: p.yaml:22: retryPlan.map.to: expected a longest interval above the shortest (retryPlan.map.from = 60 s), found 0.7 s\n");
  });
});

describe("loads the circuit models cannot follow are refused under the key that was written", () => {
  test("a constant-power fault switching off at 0 V names fault.disableAt, not the circuit", async () => {
    const result = await simulate(shortedBusProfile("  - fault: { type: converter-early, power: 500 W, enableAt: 30 V, disableAt: 0 V }"));
    expect(result.err).toBe(
      "heatledger: p.yaml:16: events[0].fault.disableAt: expected a disable (under-voltage lockout) voltage > 0 V: a constant-power load draws P/V, which grows without bound as the bus falls to 0 V, found 0 V\n",
    );
  });

  test("a constant-power load that pulls the bus to 0 V, switching off at 1e-7 V: exit 2 with the reason, not an internal error", async () => {
    // 5 kW from 400 V through 20 ohm: the most the source can give the load is Vs²/4R = 2 kW
    // (maximum power transfer, common practice), so the bus collapses toward 0 V
    const profile = shortedBusProfile("  - power-up: {}")
      .replace("busVoltage: 48 V", "busVoltage: 400 V")
      .replace("resistance: 48 ohm", "resistance: 20 ohm\n  load: { kind: constant-power, power: 5 kW, enableAt: 100 V, disableAt: 1e-7 V }");
    const result = await simulate(profile);
    expect(result.status).toBe(2);
    expect(result.err).toMatch(
      /^heatledger: p\.yaml:13: circuit\.load\.disableAt: expected a disable \(under-voltage lockout\) voltage the bus can be followed down to: the load's current P\/V grows without bound as the bus falls, and the integration could not go below [\d.e-]+ V; raise disableAt above that, found 1e-7 V\n$/,
    );
  });

  // The same collapsing load brought by an event names the event's own key and line, in simulate
  // and in retries (which runs the fault's attempts itself). 5 kW from 400 V through 20 ohm, as above.
  const collapsing = (events: string) => shortedBusProfile(events).replace("busVoltage: 48 V", "busVoltage: 400 V").replace("resistance: 48 ohm", "resistance: 20 ohm");
  const cp = "power: 5 kW, enableAt: 100 V, disableAt: 1e-7 V";
  const refusal = (line: number, field: string) =>
    new RegExp(`^heatledger: p\\.yaml:${line}: ${field.replace(/[.[\]]/g, "\\$&")}: expected a disable \\(under-voltage lockout\\) voltage the bus can be followed down to: .*, found 1e-7 V\\n$`);
  test.each([
    ["a converter-early fault", `  - fault: { type: converter-early, ${cp} }`, 16, "events[0].fault.disableAt"],
    ["an overloaded-bus fault", `  - fault: { type: overloaded-bus, load: { kind: constant-power, ${cp} } }`, 16, "events[0].fault.load.disableAt"],
    ["a power-up's own load", `  - power-up: { load: { kind: constant-power, ${cp} } }`, 16, "events[0].power-up.load.disableAt"],
  ])("%s: simulate names the event's key", async (_, events, line, field) => {
    const result = await simulate(collapsing(events));
    expect(result.status).toBe(2);
    expect(result.err).toMatch(refusal(line, field));
  });

  test("a retry block's converter-early fault: simulate and retries both name the retry's fault key and the file", async () => {
    const retry = shortedRetry("      attempts: 2\n      interval: 5 s\n      lockout: 1 min").replace("fault: { type: shorted-output }", `fault: { type: converter-early, ${cp} }`);
    for (const command of ["simulate", "retries"]) {
      const result = await run([command, "p.yaml"], { "p.yaml": collapsing(retry) });
      expect(result.status).toBe(2);
      expect(result.err).toMatch(refusal(20, "events[0].retry.fault.disableAt"));
    }
  });
});

describe("text that reaches the terminal", () => {
  test("an escape sequence in the profile's name is shown escaped, never sent raw", async () => {
    const result = await simulate(shortedBusProfile("  - power-up: {}").replace("name: shorted bus", 'name: "\\e]0;owned\\a\\e[2Jbus"'));
    expect(result.status).toBe(0);
    expect(result.out).toContain("\\u001b]0;owned\\u0007\\u001b[2Jbus");
    expect(result.out).not.toMatch(/[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/);
  });

  test("escapeControlCharacters keeps tab and newline, escapes C0, DEL, C1 and bidirectional overrides", () => {
    expect(escapeControlCharacters("a\tb\nc\u001b[31md\u007fe\u009bf\u202eg")).toBe("a\tb\nc\\u001b[31md\\u007fe\\u009bf\\u202eg");
  });

  test("floating-point noise is taken out of numbers in messages, typed values are kept", () => {
    expect(tidyNumbers("at least 0.7000000000000001 s, found 0.69 s")).toBe("at least 0.7 s, found 0.69 s");
    expect(tidyNumbers("1.2345678901234567e-7 V and 3.14159")).toBe("1.23456789012e-7 V and 3.14159");
    expect(tidyNumbers("events[12].retry")).toBe("events[12].retry");
  });

  test.each(["abc", "-5", "2.5", "1"])("network show --rows %s is refused", async (rows) => {
    const net = "form: foster\nstages:\n  - { r: 1 K/W, tau: 1 s }\n";
    const result = await run(["network", "show", "net.yaml", "--rows", rows], { "net.yaml": net });
    expect(result).toEqual({ status: 2, out: "", err: `heatledger: --rows: expected a whole number of rows from 2 to 200, found "${rows}"\n` });
  });
});
