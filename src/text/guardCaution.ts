/**
 * The caution every guard report and export carries, beside the general one (docs/guard.md,
 * "What the guard does not cover"), declared once.
 */
export const GUARD_CAUTION =
  "Caution (firmware guard): the guard is only as safe as the energy the firmware feeds it: measure the energy " +
  "into each part every tick and round it up, never skip a tick, and keep the hardware protection (fuse, " +
  "thermal cut-out) that does not depend on firmware. The worst attempt is the envelope of the attempts the " +
  "profile's circuit makes from sampled start voltages: a fault worse than the profile's is not covered. " +
  "Check the exported source on the target with the test vectors before use.";
