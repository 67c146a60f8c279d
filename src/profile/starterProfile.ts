// Starter profiles for `heatledger init`: one commented duty profile per circuit topology, with
// invented, typical values that run as written. The thermal networks are rough Foster fits of
// the kind of part named (common practice, values from memory), placeholders to be replaced by
// the user's own Zth; every key is explained beside it and listed in docs/profile-reference.md.

/** The circuit topologies `heatledger init` writes a starter profile for. */
export const STARTER_CIRCUITS = ["series-resistor", "linear-mosfet", "converter"] as const;

/** One of {@link STARTER_CIRCUITS}. */
export type StarterCircuit = (typeof STARTER_CIRCUITS)[number];

const HEADER = `# Starter duty profile written by \`heatledger init\`. Every value below is an invented, typical
# placeholder (not any part maker's data): replace it with your own parts' data, then run
#   heatledger simulate THIS-FILE
# Every key, its unit, default and an example: docs/profile-reference.md (in the npm package:
# node_modules/heatledger/docs/). Quantities take a unit ("4.7 mF", "350 ms", "40 degC") or a
# plain number in SI units. The verdict is a model's estimate: check it against the part maker's
# ratings, local codes and licensed engineering practice before relying on it.
`;

const TAIL = `events:                         # what happens, in order; each item has exactly one key
  - power-up: { label: first start }   # one pre-charge attempt from an empty capacitor
  - run: 8 h                    # contactor closed: the pre-charge element only cools
  - power-down: { off: 10 min } # bus disconnected; the discharge path drains the capacitor
  - power-up: { label: quick restart }  # starts from what the bleeder left on the capacitor
  - run: 1 h
  - power-down: { off: 1 min }  # switched off; when it is switched on again, the bus has a fault
  - retry:                      # the firmware retries into a fault until an attempt completes
      label: retries into a fault
      attempts: 4               # the most attempts before the lockout
      interval: 5 s             # start to start; must outlast an attempt (the timeout)
      backoff: 2                # each interval twice the last ...
      maxInterval: 30 s         # ... up to this
      fault: FAULT
      lockout: 5 min            # bus off after the last failed attempt
  - wait: 30 min                # the fault is cleared
  - power-up: { label: after repair }
  - run: 2 h
`;

const SERIES_RESISTOR = `name: starter, series pre-charge resistor
description: >
  A 48 V battery charges a drive's link capacitor through a wirewound resistor; a short on the
  bus makes the firmware retry and lock out.
ambient: 40 degC                # air around the parts (each part may give its own)
parts:
  - id: precharge-resistor      # its name in the reports
    role: resistor              # heated by the series resistor's power
    network:                    # Zth of a 50 W aluminium-housed wirewound resistor on a plate:
      form: foster              # r = thermal resistance, tau = time constant of each stage
      stages:                   # (typical shape, from memory; fit your own: heatledger network fit)
        - { r: 0.4 K/W, tau: 50 ms }     # wire and core
        - { r: 1.0 K/W, tau: 2 s }       # housing
        - { r: 1.8 K/W, tau: 60 s }      # plate
        - { r: 2.0 K/W, tau: 600 s }     # plate to air
    limits:
      maxTemperature: 200 degC  # the part maker's limit for the element (check your datasheet)
      margin: 20 K              # warn when the peak comes within 20 K of it
circuit:
  topology: series-resistor
  busVoltage: 51.2 V            # 16 LFP cells, full
  capacitance: 3.3 mF           # the link capacitor being charged
  resistance: 22 ohm            # time constant R·C = 73 ms; peak current 51.2 V / 22 ohm = 2.3 A
  sourceResistance: 50 mohm     # battery, fuse and wiring in series
  completion:                   # when an attempt counts as done
    fraction: 0.95              # the bus at 95 % of busVoltage (3 time constants, 0.22 s) ...
    timeout: 600 ms             # ... or the attempt is aborted at 600 ms (a short never completes)
  discharge: { kind: bleeder, resistance: 4.7 kohm }   # drains the bus while disconnected
`;

const LINEAR_MOSFET = `name: starter, linear-mode pre-charge MOSFET
description: >
  A 48 V supply charges a link capacitor through a MOSFET held in its linear region by a source
  resistor (a constant current); a short on the bus makes the firmware retry and lock out.
ambient: 40 degC                # air around the parts (each part may give its own)
parts:
  - id: precharge-mosfet        # its name in the reports
    role: mosfet                # heated by the MOSFET's drain-source power
    network:                    # junction to ambient of a TO-220 MOSFET on a small heatsink:
      form: foster              # r = thermal resistance, tau = time constant of each stage
      part: semiconductor       # names the observed node "junction"
      stages:                   # (typical shape, from memory; fit your own: heatledger network fit)
        - { r: 0.15 K/W, tau: 2 ms }     # die and solder
        - { r: 0.35 K/W, tau: 30 ms }    # copper tab
        - { r: 0.5 K/W, tau: 0.5 s }     # case to heatsink
        - { r: 2.5 K/W, tau: 120 s }     # heatsink to air
    limits:
      maxTemperature: 150 degC  # a junction limit with room below the usual 175 degC rating
      margin: 15 K              # warn when the peak comes within 15 K of it
circuit:
  topology: linear-mosfet
  busVoltage: 48 V
  capacitance: 2.2 mF           # the link capacitor being charged
  mosfet:
    gateVoltage: 5 V            # gate drive while it conducts
    thresholdVoltage: 3.5 V     # gate threshold at 25 degC
    sourceResistor: 0.5 ohm     # sets (5 V − 3.5 V) / 0.5 ohm = 3 A: full charge in C·V/I = 35 ms
    rdsOn: 15 mohm              # once fully on
    thresholdTempco: -5 mV/K    # the threshold falls as the die heats: more current (checked)
  completion:
    within: 2 V                 # done when the bus is within 2 V of busVoltage ...
    timeout: 50 ms              # ... or aborted at 50 ms: into a short the MOSFET takes 48 V × 3 A
  discharge: { kind: bleeder, resistance: 10 kohm }    # drains the bus while disconnected
`;

const CONVERTER = `name: starter, pre-charge converter
description: >
  A small constant-current converter charges a 400 V link capacitor from the battery; an
  overloaded bus keeps the bus low, the attempts time out and the firmware locks out.
ambient: 40 degC                # air around the parts (each part may give its own)
parts:
  - id: converter-switch        # its name in the reports
    role: switch                # heated by the converter's losses, (1/efficiency − 1) × output power
    network:                    # junction to ambient of a small switch on a heatsink:
      form: foster              # r = thermal resistance, tau = time constant of each stage
      part: semiconductor       # names the observed node "junction"
      stages:                   # (typical shape, from memory; fit your own: heatledger network fit)
        - { r: 0.3 K/W, tau: 5 ms }      # die
        - { r: 0.7 K/W, tau: 0.3 s }     # package
        - { r: 3 K/W, tau: 100 s }       # heatsink to air
    limits:
      maxTemperature: 125 degC  # a junction limit with room below the part's rating
      margin: 15 K              # warn when the peak comes within 15 K of it
circuit:
  topology: converter
  busVoltage: 400 V             # the battery the converter charges up to
  capacitance: 1 mF             # the link capacitor being charged
  converter:
    mode: constant-current      # or constant-power (then power, and currentLimit from 0 V)
    current: 1 A                # full charge in C·V/I = 0.4 s
    efficiency: 0.9             # 10 % of the input power heats the switch
  completion:
    fraction: 0.95              # the bus at 95 % of busVoltage ...
    timeout: 1 s                # ... or the attempt is aborted at 1 s
  discharge: { kind: bleeder, resistance: 100 kohm }   # drains the bus while disconnected
`;

const FAULTS: Record<StarterCircuit, string> = {
  "series-resistor": "{ type: shorted-output }   # the bus is shorted: each attempt runs to its timeout",
  "linear-mosfet": "{ type: shorted-output }   # the bus is shorted: each attempt runs to its timeout",
  converter: "{ type: overloaded-bus, load: { kind: resistive, resistance: 150 ohm } }   # 1 A holds the bus near 150 V",
};

const BODIES: Record<StarterCircuit, string> = { "series-resistor": SERIES_RESISTOR, "linear-mosfet": LINEAR_MOSFET, converter: CONVERTER };

/**
 * The text of a commented starter duty profile for a circuit topology: one part with a typical
 * thermal network, the circuit with typical values and what each means, and a day of events
 * (power-ups, a run, a power-down, retries into a fault with a lockout). It runs with
 * `heatledger simulate` as written and passes. Values are invented (common practice, from
 * memory), never any maker's data. Pure; never throws for a name of {@link STARTER_CIRCUITS}.
 */
export function starterProfileText(circuit: StarterCircuit): string {
  return HEADER + BODIES[circuit] + TAIL.replace("FAULT", FAULTS[circuit]);
}
