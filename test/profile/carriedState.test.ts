import { describe, expect, test } from "vitest";
import { type TimelineEvent, defaultCircuitModels, expandTimeline, loadProfile } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// A quick retry starts from a partly charged capacitor. Charging C from V0 to V1 from a source Vs
// through any resistance R dissipates ∫(Vs − V)·C dV = C·[(Vs − V0)² − (Vs − V1)²]/2 in R
// (energy balance of the RC charge: Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th
// ed. (2012), §8.8 driven RC circuit, with i = C·dV/dt), so it is less than from empty; between
// the events the bleeder Rb leaves V0 = Vs·e^(−t/(Rb·C)) (§8.3, source-free RC circuit)
// (section numbers from memory).
const VS = 48;
const C = 4.7e-3;
const R = 10;
const RB = 1000;
const FRACTION = 0.95;

function profile(offS: number): string {
  return `name: quick retry
ambient: 25 degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [{ r: 1 K/W, tau: 1 s }] }
    limits: { maxTemperature: 300 degC }
circuit:
  topology: series-resistor
  busVoltage: ${VS} V
  capacitance: ${C * 1e3} mF
  resistance: ${R} ohm
  completion: { fraction: ${FRACTION}, timeout: 2 s }
  discharge: { kind: bleeder, resistance: ${RB} ohm }
events:
  - power-up: {}
  - power-down: { off: ${offS} s }
  - power-up: {}
`;
}

function charges(offS: number): TimelineEvent[] {
  return [...expandTimeline(loadProfile(profile(offS), "q.yaml"), defaultCircuitModels)].filter(
    (e): e is TimelineEvent => e.type === "event" && e.kind === "power-up",
  );
}

describe("carried capacitor state", () => {
  const expected = (v0: number): number => (C * ((VS - v0) ** 2 - (VS - FRACTION * VS) ** 2)) / 2;

  test.each([0.5, 2, 5, 20])("a retry after %d s off dissipates C·[(Vs − V0)² − (Vs − V1)²]/2", (offS) => {
    const [first, second] = charges(offS);
    const v0 = VS * Math.exp(-offS / (RB * C));
    // the circuit model's exact exponential terms and the closed-form energy agree to rounding.
    // Measured when the tolerances were set: 1.3e-15 relative from empty, 4.3e-14 from a
    // part-charged start (the difference of two squares loses digits as V0 nears V1); the
    // bounds are about 4x those.
    expectClose(second!.startVoltageV, v0, { rel: 1e-12 });
    expectClose(first!.energyJ[0]!, expected(0), { rel: 5e-15 });
    expectClose(second!.energyJ[0]!, expected(v0), { rel: 2e-13 });
    expect(second!.energyJ[0]!).toBeLessThan(first!.energyJ[0]!);
  });
});
