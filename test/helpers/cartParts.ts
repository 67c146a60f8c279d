/**
 * The parts and circuit of an invented 48 V cart (a series-resistor pre-charge, one resistor with a
 * three-stage Foster network and a Coffin-Manson cycling model, no rating table), shared by the
 * replay tests and the replay bench: a profile is `name`, `ambient`, these lines and `events`.
 */
export const CART_PARTS = `parts:
  - id: R1
    role: resistor
    network: { form: foster, stages: [{ r: 0.5 K/W, tau: 0.2 s }, { r: 1.5 K/W, tau: 8 s }, { r: 3 K/W, tau: 120 s }] }
    limits: { maxTemperature: 150 degC, margin: 10 K }
    lifetime: { model: coffin-manson, referenceCycles: 20000, referenceRange: 80 K, exponent: 3 }
circuit:
  topology: series-resistor
  busVoltage: 48 V
  capacitance: 4.7 mF
  resistance: 15 ohm
  completion: { fraction: 0.92, timeout: 800 ms }
  discharge: { kind: bleeder, resistance: 2.2 kohm }
`;

/**
 * An invented 24 V cart profile up to its events (a series-resistor pre-charge of 2.2 mF through
 * 8.2 ohm, one resistor with a two-stage Foster network), shared by the in-process replay and
 * fleet CLI tests: append the `events:` list.
 */
export const CART_24V_HEAD = `name: invented 24 V cart
ambient: 25 degC
parts:
  - id: R1
    role: resistor
    network: { form: foster, stages: [{ r: 0.5 K/W, tau: 0.2 s }, { r: 2 K/W, tau: 20 s }] }
    limits: { maxTemperature: 90 degC, margin: 10 K }
circuit:
  topology: series-resistor
  busVoltage: 24 V
  capacitance: 2.2 mF
  resistance: 8.2 ohm
  completion: { fraction: 0.9, timeout: 500 ms }
  discharge: { kind: bleeder, resistance: 1 kohm }
`;
