import { describeFound, inputError } from "../errors/InputError.js";

/** Thermal properties of a solid at room temperature, with where they come from. */
export interface MaterialPreset {
  /** short name used on the command line and in files ("copper") */
  readonly id: string;
  /** long name as the source table gives it */
  readonly name: string;
  /** specific heat c_p [J/(kg·K)] */
  readonly specificHeatJPerKgK: number;
  /** density [kg/m³] */
  readonly densityKgPerM3: number;
  /** thermal conductivity [W/(m·K)] */
  readonly conductivityWPerMK: number;
  /** the handbook table the values belong to */
  readonly source: string;
  /**
   * "from memory": written down from recollection of the named table, not checked against a printed
   * copy while writing; verify before relying on the last digit.
   */
  readonly provenance: "from memory";
}

const INCROPERA_A1 = "Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass Transfer, 7th ed. (2011), Table A.1 (metallic solids, 300 K)";
const INCROPERA_A2 = "Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass Transfer, 7th ed. (2011), Table A.2 (nonmetallic solids, 300 K)";

/**
 * Material presets for lumped networks, declared once: every value with its source table beside it.
 * All values are at 300 K; specific heat of metals rises by roughly 5-15 % from 300 K to 600 K
 * (same tables, higher-temperature columns; from memory: copper about +8 %, aluminium about +14 %), so a hot element stores somewhat more heat than the
 * preset says, and a sizing from the preset errs on the safe side for metals.
 * Source: per entry (`source`); every entry is marked "from memory" (see MaterialPreset.provenance).
 */
export const MATERIALS: readonly MaterialPreset[] = [
  // Incropera 7th ed. Table A.1, "Copper, pure": rho 8933, cp 385, k 401 (from memory)
  { id: "copper", name: "copper, pure", densityKgPerM3: 8933, specificHeatJPerKgK: 385, conductivityWPerMK: 401, source: INCROPERA_A1, provenance: "from memory" },
  // Table A.1, "Aluminum, pure": rho 2702, cp 903, k 237 (from memory)
  { id: "aluminium", name: "aluminum, pure", densityKgPerM3: 2702, specificHeatJPerKgK: 903, conductivityWPerMK: 237, source: INCROPERA_A1, provenance: "from memory" },
  // Table A.1, "Aluminum alloy 2024-T6": rho 2770, cp 875, k 177 (from memory)
  { id: "aluminium-2024", name: "aluminum alloy 2024-T6", densityKgPerM3: 2770, specificHeatJPerKgK: 875, conductivityWPerMK: 177, source: INCROPERA_A1, provenance: "from memory" },
  // Table A.1, "Brass, cartridge (70% Cu, 30% Zn)": rho 8530, cp 380, k 110 (from memory)
  { id: "brass", name: "brass, cartridge (70% Cu, 30% Zn)", densityKgPerM3: 8530, specificHeatJPerKgK: 380, conductivityWPerMK: 110, source: INCROPERA_A1, provenance: "from memory" },
  // Table A.1, "Carbon steel, plain": rho 7854, cp 434, k 60.5 (from memory)
  { id: "steel", name: "carbon steel, plain", densityKgPerM3: 7854, specificHeatJPerKgK: 434, conductivityWPerMK: 60.5, source: INCROPERA_A1, provenance: "from memory" },
  // Table A.1, "Stainless steel, AISI 304": rho 7900, cp 477, k 14.9 (from memory)
  { id: "stainless-304", name: "stainless steel, AISI 304", densityKgPerM3: 7900, specificHeatJPerKgK: 477, conductivityWPerMK: 14.9, source: INCROPERA_A1, provenance: "from memory" },
  // Table A.1, "Nichrome (80% Ni, 20% Cr)": rho 8400, cp 420, k 12 (from memory)
  { id: "nichrome", name: "nichrome (80% Ni, 20% Cr)", densityKgPerM3: 8400, specificHeatJPerKgK: 420, conductivityWPerMK: 12, source: INCROPERA_A1, provenance: "from memory" },
  // Table A.1, "Constantan (55% Cu, 45% Ni)": rho 8920, cp 384, k 23 (from memory)
  { id: "constantan", name: "constantan (55% Cu, 45% Ni)", densityKgPerM3: 8920, specificHeatJPerKgK: 384, conductivityWPerMK: 23, source: INCROPERA_A1, provenance: "from memory" },
  // Table A.1, "Nickel, pure": rho 8900, cp 444, k 90.7 (from memory)
  { id: "nickel", name: "nickel, pure", densityKgPerM3: 8900, specificHeatJPerKgK: 444, conductivityWPerMK: 90.7, source: INCROPERA_A1, provenance: "from memory" },
  // Table A.1, "Silicon": rho 2330, cp 712, k 148 (from memory)
  { id: "silicon", name: "silicon", densityKgPerM3: 2330, specificHeatJPerKgK: 712, conductivityWPerMK: 148, source: INCROPERA_A1, provenance: "from memory" },
  // Incropera 7th ed. Table A.2, "Aluminum oxide, polycrystalline": rho 3970, cp 765, k 36.0 (from memory)
  { id: "alumina", name: "aluminum oxide, polycrystalline", densityKgPerM3: 3970, specificHeatJPerKgK: 765, conductivityWPerMK: 36, source: INCROPERA_A2, provenance: "from memory" },
  // Table A.2, "Silicon carbide": rho 3160, cp 675, k 490 (from memory)
  { id: "silicon-carbide", name: "silicon carbide", densityKgPerM3: 3160, specificHeatJPerKgK: 675, conductivityWPerMK: 490, source: INCROPERA_A2, provenance: "from memory" },
  // Steatite (a magnesium-silicate ceramic, the core and body of many wire-wound resistors) and a
  // generic technical ceramic body are not in the tables above: typical values, from memory and
  // common practice (they spread by about ±15 % between grades).
  {
    id: "steatite",
    name: "steatite ceramic (typical)",
    densityKgPerM3: 2700,
    specificHeatJPerKgK: 900,
    conductivityWPerMK: 2.5,
    source: "no handbook table: typical steatite values (common practice), spread about ±15 % between grades",
    provenance: "from memory",
  },
  {
    id: "ceramic",
    name: "technical ceramic body (typical)",
    densityKgPerM3: 2500,
    specificHeatJPerKgK: 850,
    conductivityWPerMK: 1.5,
    source: "no handbook table: typical ceramic-body values (common practice), spread about ±15 % between bodies",
    provenance: "from memory",
  },
  // FR-4 glass-epoxy laminate is not in the tables above. Typical laminate values, from memory and
  // common practice (they vary with resin and glass content by ±15 %): rho 1850, cp 1100, k 0.3 through the plane.
  {
    id: "fr4",
    name: "FR-4 glass-epoxy laminate (typical, through-plane k)",
    densityKgPerM3: 1850,
    specificHeatJPerKgK: 1100,
    conductivityWPerMK: 0.3,
    source: "no handbook table: typical laminate values (common practice), spread about ±15 % between laminates",
    provenance: "from memory",
  },
];

/**
 * Look up a material preset by its id (case-insensitive; "aluminum" is accepted for "aluminium").
 * Cost O(presets).
 * @throws InputError `bad-option` listing the known ids
 * @example
 * materialPreset("copper").specificHeatJPerKgK // => 385
 */
export function materialPreset(id: string, field = "material"): MaterialPreset {
  const key = id.trim().toLowerCase().replace(/^aluminum/, "aluminium");
  const found = MATERIALS.find((m) => m.id === key);
  if (found === undefined) throw inputError("bad-option", field, `one of the material presets ${MATERIALS.map((m) => m.id).join(", ")}`, describeFound(id));
  return found;
}
