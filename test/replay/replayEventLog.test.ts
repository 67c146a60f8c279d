import { describe, expect, test } from "vitest";
import { InputError } from "../../src/errors/InputError.js";
import type { DutyProfile } from "../../src/profile/DutyProfile.js";
import type { TimelineKind } from "../../src/profile/expandTimeline.js";
import { defaultCircuitModels } from "../../src/profile/defaultCircuitModels.js";
import { loadProfile } from "../../src/profile/loadProfile.js";
import { ProfileStress } from "../../src/profile/ProfileStress.js";
import { simulateProfile } from "../../src/profile/simulateProfile.js";
import { parseEventLog } from "../../src/replay/parseEventLog.js";
import { replayEventLog, replayProfile } from "../../src/replay/replayEventLog.js";
import { expectClose } from "../helpers/expectClose.js";
import { CART_PARTS } from "../helpers/cartParts.js";

/** An invented 48 V series-resistor pre-charge with a one-stage-plus-body resistor and a cycling model. */
const CART = `name: invented 48 V cart
ambient: 30 degC
occursPerYear: 12
${CART_PARTS}events:
  - power-up: {}
  - run: 40 s
  - power-down: { off: 30 s }
  - fault: { type: shorted-output }
  - wait: 3 s
  - retry: { attempts: 6, interval: 1.5 s, fault: { type: shorted-output }, lockout: 90 s }
  - power-up: {}
  - run: 60 s
  - fault: { type: overloaded-bus, load: { kind: resistive, resistance: 10 ohm } }
  - wait: 20 s
  - power-up: {}
  - run: 200 s
`;

/** The log word that states a timeline event kind. */
const WORD: Partial<Record<TimelineKind, string>> = {
  "power-up": "power-up",
  "shorted-output": "short",
  "overloaded-bus": "overload",
  run: "note",
  wait: "note",
  "power-down": "power-down",
  lockout: "lockout",
};

/** Damage of a profile's history through the stress layer in a given rainflow mode. */
function damageOf(profile: DutyProfile, run: (stress: ProfileStress) => number): number {
  const stress = new ProfileStress(profile, { mode: "open" });
  const endS = run(stress);
  return stress.finish(endS).parts[0]!.report.damage!.damagePerRepetition;
}

describe("replayEventLog", () => {
  // (a) Consistency, a check of the plumbing only (the same simulator runs both sides): a log that
  // states, line by line, the events of a small profile's timeline at the times `simulate` put
  // them gives the same peaks, first exceedance, energy and damage. The log's gaps are differences
  // of the timeline's start times, so times agree to rounding (1e-9 relative is far above it).
  test("a log stating a profile's own timeline replays to the same peaks, first exceedance and damage", () => {
    const profile = loadProfile(CART, "cart.yaml");
    const starts: { startS: number; kind: TimelineKind }[] = [];
    let direct = simulateProfile(profile, { models: defaultCircuitModels });
    const directDamage = damageOf(profile, (stress) => {
      direct = simulateProfile(profile, {
        models: defaultCircuitModels,
        onEvent: (event) => {
          starts.push({ startS: event.startS, kind: event.kind });
          stress.addEvent(event);
        },
        onPoint: (t, temps, kind, index) => stress.addPoint(t, temps, kind, index),
      });
      return direct.endTimeS;
    });
    expect(direct.parts[0]!.firstExceedanceS).toBeDefined(); // the short burst crosses the limit
    // the log: one line per timeline event, and a closing note at the end of the profile
    const rows = starts.map((s) => `${s.startS},${WORD[s.kind]!}`);
    const log = parseEventLog(`time,event\n${rows.join("\n")}\n${direct.endTimeS},note\n`, "cart-log.csv");
    const replayed = replayProfile(profile, log);
    let replay = replayEventLog(profile, log, { models: defaultCircuitModels }, replayed);
    const replayDamage = damageOf(replayed, (stress) => {
      replay = replayEventLog(
        profile,
        log,
        {
          models: defaultCircuitModels,
          onEvent: (event) => stress.addEvent(event),
          onPoint: (t, temps, kind, index) => stress.addPoint(t, temps, kind, index),
        },
        replayed,
      );
      return replay.simulation.endTimeS;
    });
    const a = direct.parts[0]!;
    const b = replay.simulation.parts[0]!;
    expect(replay.simulation.eventCount).toBe(direct.eventCount + 1); // the closing note
    expect(replay.simulation.outcomes).toEqual(direct.outcomes);
    expectClose(b.peakTemperatureC, a.peakTemperatureC, { rel: 1e-9 });
    expectClose(b.peakTimeS, a.peakTimeS, { rel: 1e-9 });
    expectClose(b.firstExceedanceS!, a.firstExceedanceS!, { rel: 1e-9 });
    expectClose(b.energyJ, a.energyJ, { rel: 1e-9 });
    expectClose(b.endTemperatureC, a.endTemperatureC, { rel: 1e-9 });
    expectClose(replay.simulation.endTimeS, direct.endTimeS, { rel: 1e-12 });
    expect(directDamage).toBeGreaterThan(0);
    expectClose(replayDamage, directDamage, { rel: 1e-9 });
    expect(replay.ignoredProfileEvents).toBe(12);
    expect(replay.profile.occursPerYear).toBeUndefined();
  });

  // (b) Outside check. One "short" line into a 10 ohm series resistor on a 48 V bus, no source
  // resistance: the bus is held at 0 V, so the resistor dissipates P = V²/R = 230.4 W for the whole
  // 30 s timeout (Joule heating, Ohm's law; Hayt, Kemmerly & Durbin, Engineering Circuit Analysis,
  // 8th ed. (2012), §2.4, section from memory). Its single RC stage (R_th = 2 K/W, τ = 5 s) rises
  // as P·R_th·(1 − e^(−t/τ)) (first-order step response; lumped capacitance, Incropera et al.,
  // Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.1 and §5.3). From 25 °C the
  // 325 °C limit (a 300 K rise) is first crossed at
  // t = −τ·ln(1 − 300/(P·R_th)) ≈ 5.26 s, and the peak at the end of the timeout is
  // 25 + P·R_th·(1 − e^(−6)). The crossing is found by bisection on exact rises to 1e-12 of its 30 s
  // step, 5.7e-12 of the answer (as in test/profile/firstExceedance.test.ts): measured 4.5e-12
  // when the tolerance was set, so 1.2e-11 (about twice the bracket).
  test("a long attempt into a short crosses the limit when the first-order step response says", () => {
    const profile = loadProfile(
      `name: one short
ambient: 25 degC
parts:
  - id: R
    role: resistor
    network: { form: foster, stages: [{ r: 2 K/W, tau: 5 s }] }
    limits: { maxTemperature: 325 degC }
circuit:
  topology: series-resistor
  busVoltage: 48 V
  capacitance: 1 mF
  resistance: 10 ohm
  completion: { fraction: 0.9, timeout: 30 s }
  discharge: { kind: none }
events: [{ wait: 1 s }]   # the format asks for one; the replay ignores it
`,
      "short.yaml",
    );
    const log = parseEventLog("time,event,note\n0,short,cable crushed\n45,note,unit switched off\n", "short.csv");
    const part = replayEventLog(profile, log, { models: defaultCircuitModels }).simulation.parts[0]!;
    const powerW = (48 * 48) / 10;
    const [rth, tau] = [2, 5];
    expectClose(part.firstExceedanceS!, -tau * Math.log(1 - 300 / (powerW * rth)), { rel: 1.2e-11 });
    expectClose(part.peakTemperatureC, 25 + powerW * rth * (1 - Math.exp(-30 / tau)), { rel: 1e-9 });
    expectClose(part.peakTimeS, 30, { rel: 1e-12 });
    expectClose(part.energyJ, powerW * 30, { rel: 1e-12 });
    // 15 s of cooling after the timeout: rise·e^(−15/τ)
    expectClose(part.endTemperatureC, 25 + powerW * rth * (1 - Math.exp(-30 / tau)) * Math.exp(-15 / tau), { rel: 1e-9 });
  });

  test("an overload line takes its load from the profile's first overloaded-bus fault; a profile without one is refused", () => {
    const profile = loadProfile(CART, "cart.yaml");
    const log = parseEventLog("time,event\n0,overload\n5,note\n", "o.csv");
    const events = replayProfile(profile, log).events;
    expect(events[0]).toMatchObject({ kind: "repeat", count: 1, periodS: 5, events: [{ kind: "fault", fault: { type: "overloaded-bus", load: { kind: "resistive", resistanceOhm: 10 } } }] });
    const plain = loadProfile(CART.replace(/ {2}- fault: \{ type: overloaded-bus[^\n]*\n/, ""), "plain.yaml");
    expect(() => replayProfile(plain, log)).toThrow(
      'o.csv:2: event: expected a profile whose events include a fault of type overloaded-bus, to take the "overload" values from (plain.yaml has none), found "overload"',
    );
    const noCircuit = loadProfile(
      `name: no circuit
ambient: 25 degC
parts: [{ id: R, network: { form: foster, stages: [{ r: 1 K/W, tau: 1 s }] }, limits: { maxTemperature: 100 degC } }]
events: [{ wait: 1 s }]
`,
      "nc.yaml",
    );
    expect(() => replayProfile(noCircuit, parseEventLog("time,event\n0,power-up\n", "p.csv"))).toThrow(
      'p.csv:2: event: expected a profile with a circuit for a pre-charge attempt (nc.yaml has none), found "power-up"',
    );
  });

  test("a line before the attempt above it has ended is refused on its time, with the attempt's length", () => {
    const profile = loadProfile(CART, "cart.yaml");
    const log = parseEventLog("time,event\n0,power-up\n60,power-down\n90,short\n90.5,power-down\n", "fast.csv");
    let message = "";
    try {
      replayEventLog(profile, log, { models: defaultCircuitModels });
    } catch (error) {
      expect(error).toBeInstanceOf(InputError);
      message = (error as InputError).message;
    }
    // a short lasts the whole 800 ms timeout
    expect(message).toBe(
      'fast.csv:5: time: expected a time at least 90.8 s from the start of the log: the short attempt of line 4 (at 90 s) lasts 0.8 s in the profile\'s circuit, and the model cannot end it early, found "90.5"',
    );
  });
});
