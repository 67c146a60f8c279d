import { inputError } from "../errors/InputError.js";
import type { ProfileRetrySetup } from "../retry/profileRetrySetup.js";
import { type ResolvedScenario, resolveScenario } from "../retry/RetryScenario.js";
import type { AttemptOutcome } from "../retry/RetryScenario.js";
import type { ModalModel } from "../thermal/ModalModel.js";
import { advanceModalState, createModalState, modalRise } from "../thermal/modalStep.js";
import { type PowerTrace, segmentEnergy, shiftTerms } from "../thermal/powerTrace.js";
import { interiorPeaks } from "../thermal/segmentPeak.js";
import { traceSteps } from "../thermal/traceSteps.js";
import { type DiscreteModes, discreteModes } from "./discreteModes.js";
import { GUARD_DEFAULTS } from "./guardDefaults.js";

/** One energy input of the guard: the energy the firmware measures at one heat source per tick. */
export interface GuardInput {
  /** the source's name in the network ("element", "die"), prefixed by its parts when several networks are watched */
  readonly name: string;
}

/** One watched part: its rise per mode, and the headroom table of the may-start rule. */
export interface GuardChannel {
  /** the part's id */
  readonly part: string;
  /** the guard input of each source of the part's network, by source index */
  readonly inputOfSource: readonly number[];
  readonly modes: DiscreteModes;
  /** span starts t_j [s] from an attempt's start; span j is [t_j, t_(j+1)), the last one [t_J, ∞) */
  readonly spanStartS: readonly number[];
  /** e^(−t_j/τ_m), indexed [span][mode] */
  readonly spanDecay: readonly (readonly number[])[];
  /** per corner, the highest rise the worst attempt causes from ambient in each span [K] */
  readonly responseK: readonly (readonly number[])[];
  /** per corner, limit − margin − ambient [K] */
  readonly allowedRiseK: readonly number[];
  /** per span, min over corners of (allowed rise − response) [K]: the most the decayed state may add */
  readonly headroomK: readonly number[];
  /** per span, the corner that sets the headroom */
  readonly governing: readonly string[];
  /** the largest energy one tick of an attempt puts into each source of the part's network [J] */
  readonly heaviestTickJ: readonly number[];
  /**
   * the most the tick-end rise can lie above the zero-order-hold figure for the heaviest tick,
   * when its energy lands at the tick's worst moment [K]: what the guard's gain covers
   */
  readonly placementErrorK: number;
}

/** The firmware guard of a profile, in floating point (the exact figures before any export). */
export interface ThermalGuard {
  readonly tickS: number;
  readonly inputs: readonly GuardInput[];
  readonly channels: readonly GuardChannel[];
  readonly corners: readonly string[];
  /** attempt outcomes the worst attempt was taken from (per corner and part) */
  readonly attemptsSampled: number;
  /** the first attempt alone (from ambient) crosses limit − margin in some corner: the guard never allows one */
  readonly neverSafe: boolean;
}

/**
 * Build the firmware guard of a profile's retry setup (the planner's corners, from
 * profileRetrySetup): per watched part, the network discretised at the tick (discreteModes), and
 * the headroom table of the may-start rule.
 *
 * The rule: an attempt starting from per-mode rise shares z_m (the exact ones, which the firmware's
 * estimate bounds from above) peaks at max over t ≥ 0 of Σ_m z_m·e^(−t/τ_m) + R(t), R the attempt's
 * own response from ambient (superposition). On span j, t ≥ t_j, so the first sum is at most
 * S_j = Σ_m max(z_m, 0)·e^(−t_j/τ_m), and R(t) at most the span's response maximum; the attempt is
 * safe in every corner when S_j ≤ min over corners (limit − margin − ambient − response_j) for every
 * span. The response maxima come from the exact engine (advanceModalState on the attempt's trace cut
 * at the span starts, interiorPeaks inside each piece); on the last span [t_J, ∞) the free cooling
 * is bounded by the sum of its positive mode shares. The worst attempt is the envelope over
 * attempts from GUARD_DEFAULTS.startVoltagePoints start voltages between 0 V and the highest end
 * voltage, each at a part starting at ambient and at limit − margin (for models that read the
 * part's temperature). Spans: GUARD_DEFAULTS.attemptSpans equal spans over the longest attempt,
 * then GUARD_DEFAULTS.tailSpans log-spaced ones up to GUARD_DEFAULTS.tailTauMultiple slowest time
 * constants after it.
 * Source: superposition in a linear time-invariant system (Oppenheim & Willsky, Signals and
 * Systems, 2nd ed. (1997), §2.2); the zero-order-hold discretisation of discreteModes.
 * Validity: the attempt model's start conditions are sampled, not bounded: an attempt whose
 * response is not below the envelope of the sampled ones is not covered (docs/guard.md).
 * Cost O(corners × parts × samples × cost of one attempt and its peak search).
 * @throws InputError `bad-profile` when corners of one part have different networks; whatever
 *   resolveScenario and discreteModes throw
 */
export function buildThermalGuard(setup: ProfileRetrySetup, tickS: number): ThermalGuard {
  const resolved = setup.scenarios.map((s, i) => resolveScenario(s, `corners[${i}]`));
  const parts = setup.parts;
  const byPart = parts.map((_, p) => setup.corners.map((_, c) => resolved[c * parts.length + p]!));
  // one group of inputs per distinct network (parts on one heatsink share one)
  const models: ModalModel[] = [];
  for (const corners of byPart) {
    const model = corners[0]!.model;
    corners.forEach((c, i) => {
      if (c.model !== model) throw inputError("bad-profile", `retryPlan.corners[${i}]`, "the same thermal network in every corner", `another network for ${c.name}`);
    });
    if (!models.includes(model)) models.push(model);
  }
  const inputs: GuardInput[] = [];
  const firstInput = models.map((model, g) => {
    const at = inputs.length;
    const owners = parts.filter((_, p) => byPart[p]![0]!.model === model).join("+");
    for (const source of model.sources) inputs.push({ name: models.length === 1 ? source : `${owners}.${source}` });
    return at;
  });
  let attemptsSampled = 0;
  let neverSafe = false;
  const channels = byPart.map((corners, p): GuardChannel => {
    const model = corners[0]!.model;
    const o = corners[0]!.observedIndex;
    const modes = discreteModes(model, o, tickS);
    const outcomes = corners.map((c) => sampledAttempts(c));
    attemptsSampled += outcomes.reduce((n, list) => n + list.length, 0);
    const longestS = Math.max(...outcomes.flat().map((a) => a.durationS));
    const slowest = Math.max(...model.tauS);
    const spanStartS = spanStarts(longestS, longestS + GUARD_DEFAULTS.tailTauMultiple * slowest);
    const spanDecay = spanStartS.map((t) => model.tauS.map((tau) => Math.exp(-t / tau)));
    const responseK = corners.map((c, ci) => {
      const worst = spanStartS.map(() => 0);
      for (const outcome of outcomes[ci]!) {
        spanMaxima(model, o, tracesBySource(model, c, outcome), spanStartS).forEach((r, j) => (worst[j] = Math.max(worst[j]!, r)));
      }
      return worst;
    });
    const allowedRiseK = corners.map((c) => c.allowedRiseK);
    const headroomK: number[] = [];
    const governing: string[] = [];
    spanStartS.forEach((_, j) => {
      let best = Infinity;
      let who = corners[0]!.name;
      corners.forEach((c, ci) => {
        const h = allowedRiseK[ci]! - responseK[ci]![j]!;
        if (h < best) {
          best = h;
          who = c.name;
        }
      });
      headroomK.push(best);
      governing.push(who);
    });
    if (headroomK.some((h) => h < 0)) neverSafe = true;
    const heaviestTickJ = model.sources.map(() => 0);
    corners.forEach((c, ci) => {
      for (const outcome of outcomes[ci]!) {
        tracesBySource(model, c, outcome).forEach((trace, s) => {
          if (trace !== undefined) for (const e of tickEnergies(trace, tickS)) heaviestTickJ[s] = Math.max(heaviestTickJ[s]!, e);
        });
      }
    });
    let placementErrorK = 0;
    heaviestTickJ.forEach((e, s) => modes.tauS.forEach((_, m) => (placementErrorK += (modes.boundGainKPerJ[s]![m]! - modes.zohGainKPerJ[s]![m]!) * e)));
    return {
      part: parts[p]!,
      inputOfSource: model.sources.map((_, s) => firstInput[models.indexOf(model)]! + s),
      modes,
      spanStartS,
      spanDecay,
      responseK,
      allowedRiseK,
      headroomK,
      governing,
      heaviestTickJ,
      placementErrorK,
    };
  });
  return { tickS, inputs, channels, corners: setup.corners, attemptsSampled, neverSafe };
}

/** The span starts: equal spans over the longest attempt, then log-spaced ones up to endS. */
function spanStarts(longestS: number, endS: number): number[] {
  const out: number[] = [];
  const inside = GUARD_DEFAULTS.attemptSpans;
  for (let j = 0; j < inside; j++) out.push((longestS * j) / inside);
  const tail = GUARD_DEFAULTS.tailSpans;
  for (let k = 0; k <= tail; k++) out.push(longestS * (endS / longestS) ** (k / tail));
  return out;
}

/**
 * The attempts whose envelope is the worst attempt: from start voltages spread between 0 V and the
 * highest end voltage of an attempt from the corner's first start, each with the part at ambient
 * and at limit − margin.
 */
function sampledAttempts(c: ResolvedScenario): AttemptOutcome[] {
  const first = c.attempt({ attemptIndex: 0, waitS: Infinity, capacitorVoltageV: c.initialVoltageV, partTemperatureC: c.ambientC });
  const top = Math.max(first.endVoltageV, c.initialVoltageV, 0);
  const points: number = GUARD_DEFAULTS.startVoltagePoints;
  const out: AttemptOutcome[] = [first];
  for (let k = 0; k < points; k++) {
    const v = points === 1 ? 0 : (top * k) / (points - 1);
    for (const temperature of [c.ambientC, c.allowedC]) out.push(c.attempt({ attemptIndex: 1, waitS: Infinity, capacitorVoltageV: v, partTemperatureC: temperature }));
  }
  return out;
}

/** An attempt's power per source of the model (the scenario's own source and any others it heats). */
export function tracesBySource(model: ModalModel, c: ResolvedScenario, outcome: AttemptOutcome): (PowerTrace | undefined)[] {
  return model.sources.map((name, s) => (s === c.sourceIndex ? outcome.trace : outcome.otherTraces?.[name]));
}

/**
 * The energy of a trace in each tick of length tickS from its start (attempt-local time 0) [J]:
 * segment energies between the tick boundaries, exactly (segmentEnergy on re-origined terms).
 * Cost O(segments + ticks).
 */
export function tickEnergies(trace: PowerTrace, tickS: number): number[] {
  const end = trace.reduce((t, seg) => Math.max(t, seg.startS + seg.durationS), 0);
  const ticks = Math.ceil(end / tickS - 1e-9);
  const out = new Array<number>(Math.max(0, ticks)).fill(0);
  for (const seg of trace) {
    const segEnd = seg.startS + seg.durationS;
    let k = Math.floor(seg.startS / tickS);
    for (; k < ticks && k * tickS < segEnd; k++) {
      const from = Math.max(seg.startS, k * tickS);
      const to = Math.min(segEnd, (k + 1) * tickS);
      if (to > from) out[k]! += segmentEnergy(from === seg.startS ? seg.terms : shiftTerms(seg.terms, from - seg.startS), to - from);
    }
  }
  return out;
}

/**
 * The highest rise of observed node o in each span, for power `traces` from a zero state: the
 * exact engine on the trace cut at every span start (each piece's ends and interior maxima). On
 * the last span, [t_J, ∞), no power flows and the bound Σ_m max(share_m, 0) of the free cooling
 * is used.
 */
function spanMaxima(model: ModalModel, o: number, traces: readonly (PowerTrace | undefined)[], starts: readonly number[]): number[] {
  const spans = starts.length;
  const out = starts.map(() => -Infinity);
  out[0] = 0;
  const state = createModalState(model);
  const next = createModalState(model);
  const endS = starts[spans - 1]!;
  let j = 0;
  for (const step of traceSteps(traces, 0, endS)) {
    const stepEnd = step.startS + step.durationS;
    let u = step.startS;
    while (u < stepEnd) {
      while (j + 1 < spans && starts[j + 1]! <= u) j++;
      const v = j + 1 < spans ? Math.min(stepEnd, starts[j + 1]!) : stepEnd;
      const h = v - u;
      const powers = step.powers.map((p) => (p !== undefined && u > step.startS ? shiftTerms(p, u - step.startS) : p));
      out[j] = Math.max(out[j]!, modalRise(model, state, o));
      for (const peak of interiorPeaks(model, state, h, powers, o)) out[j] = Math.max(out[j]!, peak.riseK);
      advanceModalState(model, state, h, powers, next);
      state.set(next);
      out[j] = Math.max(out[j]!, modalRise(model, state, o));
      u = v;
    }
  }
  const modes = model.tauS.length;
  let tail = 0;
  for (let m = 0; m < modes; m++) {
    let share = 0;
    model.gainKPerW[o]!.forEach((gains, s) => (share += gains[m]! * state[s * modes + m]!));
    tail += Math.max(0, share);
  }
  out[spans - 1] = Math.max(out[spans - 1]!, tail);
  for (let k = 0; k < spans; k++) if (out[k] === -Infinity) out[k] = out[k - 1] ?? 0;
  return out;
}
