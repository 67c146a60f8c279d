import { createHash } from "node:crypto";
import type { DutyProfile } from "../profile/DutyProfile.js";

/** The name and version of the fleet row format, first in every partition file. */
export const FLEET_FORMAT = "heatledger-fleet/1";

/**
 * What every row of a fleet run shares: the profile (its name, a digest of its text and of the
 * files it names, its parts and limits) and the fleet options. Partition outputs merge only when
 * their headers are equal, so rows replayed on another profile or rate never mix.
 */
export interface FleetHeader {
  readonly format: typeof FLEET_FORMAT;
  readonly profile: string;
  /** SHA-256 (hex) of the profile's text and of the texts of the files it names (not of their paths) */
  readonly profileDigest: string;
  readonly parts: readonly { readonly id: string; readonly limitC: number; readonly marginK: number }[];
  /** the stated rate of remaining life (--logs-per-year); null: each log's own span */
  readonly logsPerYear: number | null;
  /** whether a linear-mode MOSFET is among the parts (its caution is added) */
  readonly linearMosfet: boolean;
}

/**
 * The header of a fleet run on a profile.
 * Source: SHA-256 per FIPS 180-4 (node:crypto).
 * Cost O(size of the profile's texts).
 * @param namedTexts the texts of the files the profile names, in any order (the digest sorts
 *   their own digests, so the folder a profile is run from does not change it)
 */
export function fleetHeader(profile: DutyProfile, profileText: string, namedTexts: readonly string[], logsPerYear: number | undefined): FleetHeader {
  const sha256 = (text: string): string => createHash("sha256").update(text).digest("hex");
  const named = namedTexts.map(sha256).sort();
  const hash = createHash("sha256").update(sha256(profileText));
  for (const digest of named) hash.update(digest);
  return {
    format: FLEET_FORMAT,
    profile: profile.name,
    profileDigest: hash.digest("hex"),
    parts: profile.parts.map((p) => ({ id: p.id, limitC: p.limitC, marginK: p.marginK })),
    logsPerYear: logsPerYear ?? null,
    linearMosfet: profile.circuit?.topology === "linear-mosfet",
  };
}
