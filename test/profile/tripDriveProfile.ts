// An invented drive for the trip and relay-timing tests (not a test file: imported by them). A
// series resistor on a two-stage Foster network pre-charges the link; the drive trips `after` each
// completed charge and an active discharge (47 ohm) empties the link before the next attempt.

/** What the tests vary. */
export interface TripDriveSettings {
  readonly busVoltage: string;
  readonly capacitance: string;
  /** the trip delay after the contactor closes, as written ("0 s", "20 ms") */
  readonly after: string;
  /** the supervision section's capacitance range, as written */
  readonly supervisedCapacitance: string;
  /** the retryPlan section, as written */
  readonly retryPlan: string;
  /** `circuit.relay` as written; "" leaves it out */
  readonly relay?: string;
  /** `firmware.timerResolution` as written; "" or undefined leaves it out */
  readonly timer?: string;
}

export function tripDriveProfileText(s: TripDriveSettings): string {
  const relay = s.relay === undefined || s.relay === "" ? "" : `  relay: ${s.relay}\n`;
  const timer = s.timer === undefined || s.timer === "" ? "" : `firmware: { timerResolution: ${s.timer} }\n`;
  return `name: invented drive that trips after its contactor closes
ambient: 40 degC
parts:
  - id: R1
    role: resistor
    network: { form: foster, stages: [{ r: 0.5 K/W, tau: 2 s }, { r: 3 K/W, tau: 60 s }] }
    limits: { maxTemperature: 200 degC, margin: 20 K }
circuit:
  topology: series-resistor
  busVoltage: ${s.busVoltage}
  capacitance: ${s.capacitance}
  resistance: 20 ohm
  completion: { fraction: 0.95, timeout: 500 ms }
  discharge: { kind: active, resistance: 47 ohm }
${relay}${timer}supervision:
  corners: { capacitance: ${s.supervisedCapacitance} }
events:
  - retry: { attempts: 6, interval: 1 s, fault: { type: trip-after-close, after: ${s.after} }, lockout: 2 min }
retryPlan: ${s.retryPlan}
`;
}
