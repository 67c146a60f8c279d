/**
 * The closed vocabulary of a field event log (`heatledger replay`), declared once: the CLI help,
 * docs/field-logs.md and the parser read it here. Each word is what the unit's log says happened at
 * that line; every word maps to an event kind of the duty-profile format (see eventLogToEvents).
 * A light module (no library imports), so the command definition can print it in `--help`.
 */
export const LOG_WORDS = {
  "power-up": "a pre-charge attempt with the circuit's own load (circuit.load)",
  short: "a pre-charge attempt into a shorted output (the bus held at 0 V until the timeout)",
  overload: "a pre-charge attempt into an overloaded bus, with the load of the profile's first overloaded-bus fault",
  "converter-early": "a pre-charge attempt with a converter waking early, as the profile's first converter-early fault",
  trip: "the system tripped: the bus is disconnected and the discharge path drains it",
  "power-down": "the bus is switched off: the discharge path drains it",
  lockout: "the firmware holds the pre-charge off: the discharge path drains the bus",
  note: "a status line: nothing changes, the bus stays as it was (use one to extend the log past its last event)",
} as const;

/** An event word of the log. */
export type LogWord = keyof typeof LOG_WORDS;

/** The words, in the order help and messages list them. */
export const LOG_WORD_LIST = Object.keys(LOG_WORDS) as readonly LogWord[];

/** The prefix of a measured-temperature column: `measured:<part id>` (the part id as the profile writes it). */
export const MEASURED_PREFIX = "measured:";

/**
 * The columns of a field event log: `time` and `event` are required; `note`, `ambient` and any
 * number of `measured:<part id>` columns are optional.
 */
export const LOG_COLUMNS = {
  time: "seconds from the start of the log (a number), or an ISO 8601 timestamp (2026-03-02T06:15:00Z; no zone means UTC); the first line is time zero; non-decreasing",
  event: `one of ${LOG_WORD_LIST.join(", ")}`,
  note: "optional free text, shown with the event in the report",
  ambient: "optional measured ambient in °C (a plain number; empty: not measured on that line); the run keeps the profile's ambient, the comparison with measured temperatures uses this one",
  [`${MEASURED_PREFIX}<part id>`]: "optional measured temperature of that part in °C (empty: not measured on that line); the report compares the replayed temperature with it",
} as const;

/** A column name of the log. */
export type LogColumn = keyof typeof LOG_COLUMNS;
