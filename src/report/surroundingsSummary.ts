import type { DutyProfile } from "../profile/DutyProfile.js";
import { largest, surroundingsBound } from "../profile/hottestSteadySurroundings.js";
import { wrapText } from "../text/cautions.js";
import { formatNumber } from "../text/formatTable.js";

/** The `surroundings` key of a report: what varies around the parts, and the bound the planners use. */
export interface SurroundingsJson {
  /** how the ambient is given ("daily 21–41 °C, ..."); null: constant */
  readonly ambient: string | null;
  /** the ambient at profile time 0, every rise's reference [°C] */
  readonly referenceAmbientC: number;
  /** the hottest ambient of the series [°C] */
  readonly hottestAmbientC: number;
  readonly heatSources: readonly { readonly label: string; readonly part: string; readonly node: string; readonly maxPowerW: number }[];
  /** per part, the constant ambient that bounds the surroundings (what retries, supervise and guard use) [°C] */
  readonly boundingAmbientC: Readonly<Record<string, number>>;
}

/**
 * The surroundings of a profile for a report, or undefined when it has a constant ambient and no
 * heat sources. Source: hottestSteadySurroundings (the bound). Cost as surroundingsBound.
 */
export function surroundingsJson(profile: DutyProfile): SurroundingsJson | undefined {
  const s = profile.surroundings;
  if (s === undefined) return undefined;
  const bound = surroundingsBound(profile);
  return {
    ambient: s.ambientWords ?? null,
    referenceAmbientC: profile.parts[0]!.ambientC,
    hottestAmbientC: bound.hottestAmbientC,
    heatSources: s.heatSources.map((h) => ({ label: h.label ?? h.field, part: profile.parts[h.partIndex]!.id, node: h.node, maxPowerW: largest(h.powerW.values) })),
    boundingAmbientC: Object.fromEntries(profile.parts.map((p, i) => [p.id, bound.hottestAmbientC + bound.heatRiseK[i]!])),
  };
}

/**
 * The optional `surroundings` key of a report's JSON (absent for a constant ambient without heat
 * sources), spread into the report object: `{ ...report, ...surroundingsOf(profile) }`.
 */
export function surroundingsOf(profile: DutyProfile): { surroundings?: SurroundingsJson } {
  const surroundings = surroundingsJson(profile);
  return surroundings === undefined ? {} : { surroundings };
}

/**
 * The report lines saying what varies around the parts (none for a constant ambient), each
 * shorter than 100 columns for short names. Cost as surroundingsJson.
 */
export function surroundingsLines(profile: DutyProfile): string[] {
  const j = surroundingsJson(profile);
  if (j === undefined) return [];
  const out = [`ambient: ${j.ambient ?? `constant ${formatNumber(j.referenceAmbientC, 4)} °C`}`];
  for (const h of j.heatSources) out.push(`heat source: ${h.label} on node ${h.node} of ${h.part}'s network, up to ${formatNumber(h.maxPowerW, 4)} W`);
  return out;
}

/**
 * The note a constant-ambient planner (retries, supervise, guard) prints for a profile with
 * surroundings: which constant ambient its answers hold for, per part, wrapped to `width`, with a
 * blank line after it. Empty without surroundings. Cost as surroundingsJson.
 */
export function surroundingsBoundNote(profile: DutyProfile, width = 100): string {
  const j = surroundingsJson(profile);
  if (j === undefined) return "";
  const parts = Object.entries(j.boundingAmbientC).map(([id, c]) => `${id} ${formatNumber(c, 4)} °C`);
  const text =
    `The ambient varies (${surroundingsLines(profile).join("; ")}). These answers are for the constant ambient that ` +
    `bounds it: the hottest ambient plus each heat source's highest power times its steady resistance (${parts.join(", ")}).`;
  return `${wrapText(text, width)}\n\n`;
}
