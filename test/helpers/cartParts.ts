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
