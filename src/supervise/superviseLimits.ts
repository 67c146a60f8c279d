import type { AttemptProtection } from "../circuits/AttemptProtection.js";
import type { CircuitModels } from "../profile/CircuitModels.js";
import type { DutyProfile, ProfileCircuit } from "../profile/DutyProfile.js";
import type { HealthyBus } from "./superviseHealthyBus.js";

/**
 * A limit on every attempt that supervise recommends beside the bus checks: a firmware I²t limit
 * on the pre-charge path's current or a maximum on-time, with the healthy value it clears and
 * what it lets a hard short put into the part.
 */
export interface LimitRecommendation {
  readonly kind: "firmware-i2t" | "max-on-time";
  /** the value written into the profile fragment [A²s] or [s] */
  readonly value: number;
  /** the highest value any healthy corner reaches: ∫i² dt of its whole charge [A²s], or its completion time [s] */
  readonly healthyValue: number;
  readonly healthyCorner: string;
  /** when the limit alone ends an attempt into a hard short at the highest bus voltage [s] */
  readonly shortFiringS: number;
  /** energy that attempt puts into the part [J] */
  readonly shortEnergyJ: number;
}

/** Significant digits of a limit written into the profile fragment (rounded up: the healthy side). */
const LIMIT_DIGITS = 4;

/** x rounded up to LIMIT_DIGITS significant digits, the written decimal never below x. */
export function roundLimitUp(x: number): number {
  if (!(x > 0) || !Number.isFinite(x)) return x;
  const step = 10 ** (Math.floor(Math.log10(x)) - LIMIT_DIGITS + 1);
  let k = Math.ceil(x / step);
  const at = (j: number): number => Number((j * step).toPrecision(LIMIT_DIGITS));
  while (at(k) < x) k += 1;
  return at(k);
}

/** Decade steps searched for an I²t bracket (1e-30 to 1e30 A²s), and bisection steps inside it (2^-50 of a decade). */
const I2T_DECADES = 60;
const I2T_BISECTION_STEPS = 50;

/**
 * ∫i² dt of a healthy corner's whole charge (start voltage to its completion threshold), as the
 * profile's own protection monitor integrates it: the largest firmware I²t limit the charge trips
 * is found by bisection on log(limit), so the value is the model's own (closed form for the linear
 * circuits: for a series resistor without load (Vs − V0)²·C·(1 − (1 − k')²)/(2·Rt), k' the share
 * of the rise done, from i = ((Vs − V0)/Rt)·e^(−t/RtC) squared and integrated).
 * Cost: about 60 circuit runs.
 */
export function healthyChargeI2t(models: CircuitModels, circuit: ProfileCircuit, bus: HealthyBus, startVoltageV: number, horizonS: number): number {
  const at = { ...circuit, capacitanceF: bus.corner.capacitanceF, busVoltageV: bus.corner.busVoltageV } as ProfileCircuit;
  const trips = (limitA2s: number): boolean =>
    models.charge(at, bus.corner.load, {
      sourceVoltageV: bus.corner.busVoltageV,
      initialVoltageV: startVoltageV,
      completion: { ...bus.corner.completion, timeoutS: horizonS, protection: { i2t: [{ limitA2s, kind: "firmware" }] } },
    }).outcome === "tripped";
  let lo = -30;
  if (!trips(10 ** lo)) return 0;
  let hi = lo + 1;
  while (trips(10 ** hi)) {
    lo = hi;
    hi += 1;
    if (hi - -30 > I2T_DECADES) return Infinity;
  }
  for (let n = 0; n < I2T_BISECTION_STEPS; n++) {
    const mid = 0.5 * (lo + hi);
    if (trips(10 ** mid)) lo = mid;
    else hi = mid;
  }
  return 10 ** hi;
}

/**
 * The firmware I²t limit and the maximum on-time supervise recommends, each when it helps:
 * - maximum on-time: (1 + margin) × the slowest healthy completion time, rounded up; recommended
 *   when it ends attempts sooner than the profile's timeout (every fault, a weak one the bus checks
 *   miss included, then runs at most that long);
 * - firmware I²t: (1 + margin) × the largest ∫i² dt of a healthy charge, rounded up; recommended when
 *   it ends an attempt into a hard short sooner than the timeout and the on-time limit. The path's
 *   current heats a series element as R·i², so the limit caps the energy of every attempt, whatever
 *   the fault, at about R × limit (Joule heating, common practice).
 * An over-current trip with a delay is not recommended: the current of a resistive pre-charge path
 * is (Vs − V)/R, so a level held for a delay is a bus-voltage check at a set time, which the
 * early-abort check already is.
 * Each limit's firing into a hard short at `busV` is the circuit model's own (one run with the limit alone).
 * Cost: about 60 circuit runs per healthy corner, plus two.
 */
export function superviseLimits(
  profile: DutyProfile,
  models: CircuitModels,
  role: string,
  buses: readonly HealthyBus[],
  busV: number,
  marginFraction: number,
  startVoltageV: number,
  horizonS: number,
): LimitRecommendation[] {
  const circuit = profile.circuit!;
  const timeoutS = circuit.completion.timeoutS;
  const atShort = { ...circuit, busVoltageV: busV } as ProfileCircuit;
  const intoShort = (protection: AttemptProtection) => {
    const run = models.charge(atShort, { kind: "short" }, { sourceVoltageV: busV, initialVoltageV: 0, completion: { timeoutS, fraction: 0.5, protection } });
    return { shortFiringS: run.durationS, shortEnergyJ: run.energy.partsJ[role] ?? 0, tripped: run.outcome === "tripped" };
  };
  const out: LimitRecommendation[] = [];
  let slowest = buses[0]!;
  for (const b of buses) if (b.completionS > slowest.completionS) slowest = b;
  let endS = timeoutS;
  if (Number.isFinite(slowest.completionS)) {
    const value = roundLimitUp((1 + marginFraction) * slowest.completionS);
    if (value < timeoutS) {
      const { tripped, ...short } = intoShort({ maxOnTimeS: value });
      if (tripped) {
        out.push({ kind: "max-on-time", value, healthyValue: slowest.completionS, healthyCorner: slowest.corner.name, ...short });
        endS = value;
      }
    }
  }
  let highest = { value: 0, corner: "" };
  for (const b of buses) {
    const value = healthyChargeI2t(models, circuit, b, startVoltageV, horizonS);
    if (value > highest.value) highest = { value, corner: b.corner.name };
  }
  if (highest.value > 0 && Number.isFinite(highest.value)) {
    const value = roundLimitUp((1 + marginFraction) * highest.value);
    const { tripped, ...short } = intoShort({ i2t: [{ limitA2s: value, kind: "firmware" }] });
    if (tripped && short.shortFiringS < endS) out.unshift({ kind: "firmware-i2t", value, healthyValue: highest.value, healthyCorner: highest.corner, ...short });
  }
  return out;
}
