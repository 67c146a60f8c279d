// The invented long profile both `simulate` benchmarks run: a shuttle that power-cycles every
// 20 minutes (29 days a month), one fault burst and a long run each month, real series-resistor
// model. `partKeys` adds YAML lines to the resistor part (indented 4 spaces), e.g. stress keys.
export function shuttleProfileText(months: number, partKeys = ""): string {
  return `name: bench, power-ups every 20 minutes for ${months} months with monthly fault bursts
ambient: 40 degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [{ r: 0.3 K/W, tau: 30 ms }, { r: 1 K/W, tau: 2 s }, { r: 2 K/W, tau: 60 s }, { r: 1.5 K/W, tau: 900 s }] }
    limits: { maxTemperature: 200 degC }
${partKeys}circuit:
  topology: series-resistor
  busVoltage: 48 V
  capacitance: 3.3 mF
  resistance: 22 ohm
  completion: { fraction: 0.92, timeout: 600 ms }
  discharge: { kind: bleeder, resistance: 4.7 kohm }
events:
  - repeat:
      count: ${months}
      period: 30 day
      events:
        - repeat:
            count: ${29 * 72}
            period: 20 min
            events:
              - power-up: {}
              - run: 15 min
              - power-down: {}
        - retry: { attempts: 5, interval: 2 s, backoff: 2, fault: { type: shorted-output }, faultyAttempts: 3, lockout: 5 min }
        - run: 8 h
        - power-down: {}
`;
}
