// Invented test profile shared by CLI tests (not a test file): a 48 V pre-charge resistor of 48 Ω
// on one Foster stage (2 K/W, τ = 5 s), limit 100 °C with a 10 K margin, ambient 25 °C. Into a
// shorted bus (held at 0 V) it dissipates Vs²/R = 48 W until the 0.5 s timeout.

/** The profile's text with the given `events:` items (indented two spaces) and optional sections after them. */
export function shortedBusProfile(events: string, sections = ""): string {
  return `name: shorted bus
ambient: 25 degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [{ r: 2 K/W, tau: 5 s }] }
    limits: { maxTemperature: 100 degC, margin: 10 K }
circuit:
  topology: series-resistor
  busVoltage: 48 V
  capacitance: 1 mF
  resistance: 48 ohm
  completion: { fraction: 0.95, timeout: 500 ms }
  discharge: { kind: bleeder, resistance: 10 kohm }
events:
${events}
${sections}`;
}

/** A retry block into a shorted output as an `events:` item; `keys` are its other keys, indented six spaces. */
export function shortedRetry(keys: string): string {
  return `  - retry:
${keys}
      fault: { type: shorted-output }`;
}
