import { describeFound } from "../errors/InputError.js";
import { type FieldReader, join } from "../format/FieldReader.js";
import { parseQuantityTable } from "../format/parseQuantityTable.js";
import { networkDriveGains } from "../thermal/networkDriveGains.js";
import { type PiecewiseLinearSeries, validateSeries } from "../thermal/PiecewiseLinearSeries.js";
import type { ProfilePart } from "./DutyProfile.js";
import type { ProfileHeatSource } from "./ProfileSurroundings.js";
import { powerTracePoints } from "./powerTracePoints.js";
import type { ProfileInput } from "./profileSchema.js";
import type { ReadNamedFile } from "./ReadNamedFile.js";
import { whyUnreadable } from "./resolveProfilePart.js";

/** Seconds in a day: the period of a daily ambient. */
export const DAY_S = 86_400;

/**
 * Straight pieces a daily cosine ambient is drawn with (one every 15 min). The largest gap
 * between a cosine of amplitude A and its chord over a piece of phase step φ = 2π/96 is
 * A·(1 − cos(φ/2)) ≈ A·φ²/8 = A·5.4e-4 (5 mK for a 10 K amplitude), which is what the exact
 * integration of the straight pieces then carries.
 */
export const DAILY_AMBIENT_PIECES = 96;

/*
 * Reading `ambientProfile` and `heatSources` (loadProfile orchestrates). Every problem goes to the
 * reader with its field; a value that cannot be read yields undefined.
 */

/** The `ambientProfile` section as a series of °C over profile time, with words for reports. */
export function resolveAmbientProfile(
  reader: FieldReader,
  input: NonNullable<ProfileInput["ambientProfile"]>,
  readFile: ReadNamedFile | undefined,
): { series: PiecewiseLinearSeries; words: string } | undefined {
  const field = "ambientProfile";
  const given = (["daily", "table", "file"] as const).filter((k) => input[k] !== undefined);
  if (given.length !== 1) {
    reader.fail("bad-profile", field, "exactly one of daily (min, max, maxAt), table ([time of day, temperature] pairs) or file (a CSV of time, temperature)", given.length === 0 ? "none" : given.join(" and "));
    return undefined;
  }
  const startS = input.startAt ?? 0;
  if (input.startAt !== undefined && input.file !== undefined) {
    reader.fail("bad-profile", join(field, "startAt"), "startAt only with daily or table (a file gives profile times)", describeFound(input.startAt));
    return undefined;
  }
  if (input.daily !== undefined) {
    const { min, max, maxAt } = input.daily;
    if (!(max >= min)) {
      reader.fail("out-of-range", join(field, "daily.max"), `a maximum ≥ the minimum (${min} °C)`, `${max} °C`);
      return undefined;
    }
    const mid = 0.5 * (max + min);
    const amplitude = 0.5 * (max - min);
    const timesS: number[] = [];
    const values: number[] = [];
    for (let k = 0; k < DAILY_AMBIENT_PIECES; k++) {
      const t = (k * DAY_S) / DAILY_AMBIENT_PIECES;
      timesS.push(t);
      values.push(mid + amplitude * Math.cos((2 * Math.PI * (t + startS - maxAt)) / DAY_S));
    }
    return { series: { timesS, values, periodS: DAY_S }, words: `daily ${min}–${max} °C, maximum at ${hours(maxAt)}, start at ${hours(startS)}` };
  }
  if (input.table !== undefined) {
    const points = input.table.map(([t, v]) => ({ t: (((t - startS) % DAY_S) + DAY_S) % DAY_S, v, written: t }));
    points.sort((a, b) => a.t - b.t);
    const twice = points.findIndex((p, i) => i > 0 && p.t === points[i - 1]!.t);
    if (twice > 0) {
      reader.fail("bad-profile", join(field, "table"), "each time of day once (0 h and 24 h are the same time)", `${hours(points[twice]!.written)} twice`);
      return undefined;
    }
    const words = `daily table of ${points.length} points, start at ${hours(startS)}`;
    return { series: { timesS: points.map((p) => p.t), values: points.map((p) => p.v), periodS: DAY_S }, words };
  }
  const at = join(field, "file");
  const text = readText(reader, readFile, input.file!, at, "a readable CSV file of time, ambient temperature");
  if (text === undefined) return undefined;
  try {
    const name = readFile!.displayName?.(input.file!) ?? input.file!;
    const table = parseQuantityTable(
      text,
      [
        { key: "time", headerPattern: /^t(ime)?$/i, dimension: "time", unitOption: 'a unit in the header, such as "time [h]"' },
        { key: "ambient", headerPattern: /^(ambient|temperature|t_?amb)$/i, dimension: "temperature", unitOption: 'a unit in the header, such as "ambient [degC]"' },
      ],
      name,
    );
    const series = { timesS: table.rows.map((r) => r.values[0]!), values: table.rows.map((r) => r.values[1]!) };
    validateSeries(series, at);
    return { series, words: `trace ${input.file} (${series.timesS.length} points)` };
  } catch (error) {
    reader.absorb(error);
    return undefined;
  }
}

/** The `heatSources` list, each checked against its part's network. */
export function resolveHeatSources(
  reader: FieldReader,
  input: NonNullable<ProfileInput["heatSources"]>,
  parts: readonly (ProfilePart | undefined)[],
  partIds: readonly string[],
  readFile: ReadNamedFile | undefined,
): ProfileHeatSource[] {
  const out: ProfileHeatSource[] = [];
  input.forEach((h, i) => {
    const field = `heatSources[${i}]`;
    const partIndex = partIds.indexOf(h.part);
    if (partIndex < 0) {
      reader.fail("bad-profile", join(field, "part"), `the id of a part (${partIds.join(", ")})`, describeFound(h.part));
      return;
    }
    const part = parts[partIndex];
    if (part === undefined) return;
    if (part.network === undefined) {
      reader.fail("bad-profile", join(field, "part"), "a part with a graph or Cauer network", `"${h.part}" (a modal model only)`);
      return;
    }
    try {
      networkDriveGains(part.network, [part.model.observed[part.observedIndex]!], [h.node], join(field, "node"));
    } catch (error) {
      reader.absorb(error);
      return;
    }
    if ((h.power === undefined) === (h.file === undefined)) {
      reader.fail("bad-profile", field, "exactly one of power (a constant such as \"150 W\") or file (a CSV of time, power)", h.power === undefined ? "neither" : "both");
      return;
    }
    const scale = h.scale ?? 1;
    let powerW: PiecewiseLinearSeries;
    if (h.power !== undefined) powerW = { timesS: [0], values: [scale * h.power] };
    else {
      const at = join(field, "file");
      const text = readText(reader, readFile, h.file!, at, "a readable CSV file of time, power");
      if (text === undefined) return;
      try {
        const points = powerTracePoints(text, readFile!.displayName?.(h.file!) ?? h.file!, at);
        powerW = { timesS: points.timeS, values: points.powerW.map((p) => scale * p) };
      } catch (error) {
        reader.absorb(error);
        return;
      }
    }
    out.push({ field, ...(h.label === undefined ? {} : { label: h.label }), partIndex, node: h.node, powerW });
  });
  return out;
}

function readText(reader: FieldReader, readFile: ReadNamedFile | undefined, path: string, at: string, what: string): string | undefined {
  if (readFile === undefined) {
    reader.fail("bad-file", at, "no file (this caller cannot read files)", describeFound(path));
    return undefined;
  }
  try {
    return readFile(path);
  } catch (error) {
    reader.fail("bad-file", at, what, `${describeFound(path)} (${whyUnreadable(error, readFile.displayName?.(path))})`);
    return undefined;
  }
}

function hours(s: number): string {
  return `${Number((s / 3600).toFixed(2))} h`;
}
