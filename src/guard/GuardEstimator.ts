/**
 * The firmware guard as it runs on the target, one implementation per number type (the fixed-point
 * and floating-point exports each have a TypeScript twin that does the same arithmetic in the
 * same order as their C source): the test vectors and the conservatism comparison run these.
 */
export interface GuardEstimator {
  /** one tick: every mode decays and takes the energy each input received in the tick [J] */
  tick(energyJ: readonly number[]): void;
  /** the estimated rise of each watched part over ambient [K] (never below the exact rise at tick instants) */
  riseK(): number[];
  /** true when an attempt may start now: the decayed state plus the worst attempt stays under limit − margin on every span */
  mayStart(): boolean;
  /** whole ticks of free cooling until mayStart holds (0 when it holds now); null when it never will */
  cooldownTicks(): number | null;
  /** the raw state, for the test vectors (Q integers or doubles), indexed [part][mode] */
  state(): (number | bigint)[][];
  /** the energy each input is fed as, for the test vectors (Q integers or the doubles themselves) */
  quantiseEnergy(energyJ: readonly number[]): (number | bigint)[];
}
