// Invented profiles whose charging loss has a closed form, shared by the study and corner tests.

/**
 * The adiabatic limit: one Foster stage with tau = 1e7 s (heat capacity tau/r = 100 J/K) takes the
 * whole charging loss of a series-resistor pre-charge, C·Vs²·(f − f²/2) with f = 0.95 (0.49875).
 */
export const ADIABATIC = `name: adiabatic limit
ambient: 25 degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [{ r: 100000 K/W, tau: 10000000 s }] }
    limits: { maxTemperature: 100 degC }
circuit:
  topology: series-resistor
  busVoltage: 60 V
  capacitance: 2 mF
  resistance: 6 ohm
  completion: { fraction: 0.95, timeout: 1 s }
  discharge: { kind: none }
events:
  - power-up: {}
`;

/**
 * A series resistor R = 6 ohm behind a source resistance Rs = 2 ohm charging 2 mF to 0.95·60 V:
 * the loss C·Vs²·(f − f²/2) = 3.591 J is split R/(R + Rs). One Foster stage r = 1 K/W, tau = 1000 s.
 * @param maxC the part's maximum temperature [°C] (margin 1 K)
 * @param events the events block (YAML, indented two spaces)
 * @param discharge the discharge path (YAML flow map)
 */
export function splitProfile(maxC: number, events = "  - power-up: {}\n", discharge = "{ kind: none }"): string {
  return `name: split
ambient: 25 degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [{ r: 1 K/W, tau: 1000 s }] }
    limits: { maxTemperature: ${maxC} degC, margin: 1 K }
circuit:
  topology: series-resistor
  busVoltage: 60 V
  capacitance: 2 mF
  resistance: 6 ohm
  sourceResistance: 2 ohm
  completion: { fraction: 0.95, timeout: 1 s }
  discharge: ${discharge}
events:
${events}`;
}
