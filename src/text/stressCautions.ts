/**
 * Caution carried by every stress report that computes damage (in the spirit of docs/design.md, "Cautions"): lifetime
 * figures are fitted-model estimates. The general caution and the linear-mode MOSFET caution
 * are declared once in src/text/cautions.ts and reused, not repeated here.
 */
export const LIFETIME_CAUTION =
  "Caution (lifetime): damage and life figures are estimates from a fitted cycling model under Miner's linear rule, " +
  "only as good as its parameters and their fitted range; they are not a guarantee of life.";
