// Invented field logs for the fleet tests and bench: a unit of the bundled irrigation pump drive
// (profiles/irrigation-pump-decade.yaml) starting twice a day, with a fault injected on request.
// Times in seconds from the first line; a small deterministic jitter per unit and day.

/** What is wrong with a unit: nothing, a fault its part feels, or a log the replay must refuse. */
export type InjectedFault = "none" | "storm" | "shorts" | "backwards" | "unknown-word" | "garbage";

/** A unit's log text, and for a refused log the file line the error must name. */
export interface UnitLog {
  readonly text: string;
  readonly badLine?: number;
}

/** A tiny 32-bit linear congruential generator (multiplier 1664525, increment 1013904223; common practice, from memory): jitter only. */
function jitter(seed: number): () => number {
  let state = (seed * 2654435761) >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

/**
 * The log of unit `index` over `days` days: a start at about 6 h and 16 h of every day, each
 * switched off 5 h later. "storm": on the second day's morning, 60 attempts into an overloaded
 * bus 2 s apart (the bundled profile's resistor goes above its 180 °C limit); "shorts": two
 * attempts into a shorted output 10 s apart (over the resistor's pulse-energy rating);
 * "backwards": a line whose time is earlier than the line above; "unknown-word": a misspelt
 * event word; "garbage": a line of noise.
 */
export function fleetUnitLog(index: number, fault: InjectedFault, days = 3): UnitLog {
  const random = jitter(index + 1);
  const rows: [number, string][] = [];
  for (let day = 0; day < days; day++) {
    for (const hour of [6, 16]) {
      const t = day * 86400 + hour * 3600 + Math.floor(random() * 1200);
      if (day === 1 && hour === 6 && fault === "storm") {
        for (let i = 0; i < 60; i++) rows.push([t + 2 * i, "overload"]);
        rows.push([t + 120, "power-down"]);
        continue;
      }
      if (day === 1 && hour === 6 && fault === "shorts") {
        rows.push([t, "short"], [t + 10, "short"], [t + 12, "lockout"], [t + 3 * 3600, "power-down"]);
        continue;
      }
      rows.push([t, "power-up"], [t + 5 * 3600, "power-down"]);
    }
  }
  const lines = rows.map(([t, word]) => `${t - rows[0]![0]},${word}`);
  // data line k (0-based) is file line k + 3 (a comment line and the header first)
  const at = 5;
  let badLine: number | undefined;
  if (fault === "backwards") {
    lines[at] = `${Number(lines[at - 1]!.split(",")[0]) - 60},power-up`;
    badLine = at + 3;
  } else if (fault === "unknown-word") {
    lines[at] = `${lines[at]!.split(",")[0]},power-upp`;
    badLine = at + 3;
  } else if (fault === "garbage") {
    lines[at] = "\u0007~~ #!%& noise ~~";
    badLine = at + 3;
  }
  const text = `# invented unit ${index} (${fault})\ntime,event\n${lines.join("\n")}\n`;
  return badLine === undefined ? { text } : { text, badLine };
}
