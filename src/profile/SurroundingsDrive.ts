import type { ModalModel } from "../thermal/ModalModel.js";
import type { SourcePowers } from "../thermal/modalStep.js";
import { networkDriveGains } from "../thermal/networkDriveGains.js";
import { type PiecewiseLinearSeries, type SeriesPiece, seriesPieceAt } from "../thermal/PiecewiseLinearSeries.js";
import { type PowerTerm, shiftTerms } from "../thermal/powerTrace.js";
import type { TimedStep } from "../thermal/traceSteps.js";
import type { ProfilePart } from "./DutyProfile.js";
import type { ProfileSurroundings } from "./ProfileSurroundings.js";

/**
 * Time constant [s] of the mode that carries the ambient into a part that follows it at once (a
 * Foster network): fed with FOLLOW_TAU_S × the ambient's slope, a first-order mode this slow is an
 * integrator to the last bit (e^(−h/tau) rounds to 1 for any step of a profile, whose length is at
 * most 1e12 s), so its state is the ambient's change since time 0, exactly, straight piece by
 * straight piece; its gain is 1 K/K.
 */
export const FOLLOW_TAU_S = 1e30;

/**
 * The profile's combined modal model widened by the surroundings, and the step splitter that
 * feeds it. Extra input columns after the parts: the ambient's change since time 0 (K, into the
 * graph and Cauer networks through their links to ambient, networkDriveGains), its slope × FOLLOW_TAU_S
 * (into the follow mode of Foster parts), and each heat source's power (W, on its node). Every
 * step handed to `push` is cut at the corners of the ambient and power series, so each input is
 * one straight piece a + b·s on every step and the modal update stays exact.
 * Source: superposition of the exact modal responses (linear network), as simulateProfile.
 * Cost O(parts × (parts + inputs) × modes) to build; per step O(series pieces crossed × log points).
 */
export class SurroundingsDrive {
  /** the widened model (its first sources and observed nodes are the parts, in order) */
  readonly model: ModalModel;
  private readonly series: PiecewiseLinearSeries[] = [];
  /** per series: subtract this from the value (the ambient at time 0), and FOLLOW_TAU_S-slope column after it */
  private readonly offsets: number[] = [];
  private readonly withRate: boolean[] = [];
  private readonly partCount: number;
  private readonly pieces: SeriesPiece[] = [];

  /**
   * @param parts the profile's parts (networks as written, for the drive gains)
   * @param base combinedModel(parts)
   * @param surroundings the profile's surroundings
   */
  constructor(parts: readonly ProfilePart[], base: ModalModel, surroundings: ProfileSurroundings) {
    this.partCount = parts.length;
    const networkBase = new Map<string, number>();
    let modes = 0;
    for (const p of parts) {
      if (networkBase.has(p.networkKey)) continue;
      networkBase.set(p.networkKey, modes);
      modes += p.model.tauS.length;
    }
    const ambient = surroundings.ambientC;
    const followers = parts.map((p) => p.network === undefined || p.network.kind === "foster");
    const follow = ambient !== undefined && followers.some((f) => f);
    const tauS = follow ? [...base.tauS, FOLLOW_TAU_S] : base.tauS.slice();
    const widen = (row: readonly number[]): number[] => (follow ? [...row, 0] : row.slice());
    const gainKPerW = base.gainKPerW.map((rows) => rows.map(widen));
    const sources = base.sources.slice();
    const zero = (): number[] => new Array<number>(tauS.length).fill(0);
    const gainsOf = (p: ProfilePart, nodes: readonly string[]) =>
      p.network === undefined ? undefined : networkDriveGains(p.network, [p.model.observed[p.observedIndex]!], nodes, p.networkKey);
    if (ambient !== undefined) {
      sources.push("ambient");
      parts.forEach((p, o) => {
        const row = zero();
        const drive = followers[o] ? undefined : gainsOf(p, []);
        if (drive?.ambientGain !== undefined) {
          assertSameModes(drive.tauS, p.model.tauS, p.networkKey);
          drive.ambientGain[0]!.forEach((g, m) => (row[networkBase.get(p.networkKey)! + m] = g));
        }
        gainKPerW[o]!.push(row);
      });
      this.series.push(ambient);
      this.offsets.push(parts[0]!.ambientC);
      this.withRate.push(follow);
      if (follow) {
        sources.push("ambient-follow");
        parts.forEach((_, o) => {
          const row = zero();
          if (followers[o]) row[tauS.length - 1] = 1;
          gainKPerW[o]!.push(row);
        });
      }
    }
    for (const h of surroundings.heatSources) {
      const host = parts[h.partIndex]!;
      sources.push(h.label ?? `${h.field}:${h.node}`);
      parts.forEach((p, o) => {
        const row = zero();
        if (p.networkKey === host.networkKey) {
          const drive = gainsOf(p, [h.node])!;
          assertSameModes(drive.tauS, p.model.tauS, p.networkKey);
          drive.sourceGainKPerW[0]![0]!.forEach((g, m) => (row[networkBase.get(p.networkKey)! + m] = g));
        }
        gainKPerW[o]!.push(row);
      });
      this.series.push(h.powerW);
      this.offsets.push(0);
      this.withRate.push(false);
    }
    this.model = { tauS, sources, observed: base.observed.slice(), gainKPerW };
  }

  /**
   * Cut a step of the parts' powers at every corner of the surroundings' series and hand each
   * piece, with the inputs' terms, to `push`.
   */
  split(step: TimedStep, push: (step: TimedStep) => void): void {
    const end = step.startS + step.durationS;
    let t = step.startS;
    do {
      let next = end;
      for (let k = 0; k < this.series.length; k++) {
        let piece = seriesPieceAt(this.series[k]!, t);
        // rounding can leave t on a piece's last instant: take the next piece
        if (!(piece.endS > t)) piece = seriesPieceAt(this.series[k]!, piece.endS + Math.abs(piece.endS) * Number.EPSILON);
        this.pieces[k] = piece;
        if (piece.endS < next) next = piece.endS;
      }
      const powers: (readonly PowerTerm[] | undefined)[] = new Array(this.model.sources.length);
      const delta = t - step.startS;
      for (let s = 0; s < this.partCount; s++) {
        const terms = step.powers[s];
        powers[s] = terms === undefined || terms.length === 0 || delta === 0 ? terms : shiftTerms(terms, delta);
      }
      let column = this.partCount;
      for (let k = 0; k < this.series.length; k++) {
        const piece = this.pieces[k]!;
        const a = piece.value + (piece.slope === 0 ? 0 : piece.slope * (t - piece.startS)) - this.offsets[k]!;
        powers[column++] = a === 0 && piece.slope === 0 ? undefined : [{ a, b: piece.slope, lambda: 0 }];
        if (this.withRate[k]) powers[column++] = piece.slope === 0 ? undefined : [{ a: FOLLOW_TAU_S * piece.slope, b: 0, lambda: 0 }];
      }
      push({ startS: t, durationS: next - t, powers: powers as SourcePowers });
      t = next;
    } while (t < end);
  }
}

/**
 * The drive gains must sit on the part's own modes: the same reduction of the same network, or
 * of a network whose capacities were all scaled (sizing), whose time constants are the model's
 * scaled ones to rounding.
 */
function assertSameModes(a: readonly number[], b: readonly number[], key: string): void {
  if (a.length !== b.length || a.some((tau, m) => !(Math.abs(tau - b[m]!) <= 1e-9 * b[m]!))) throw new Error(`surroundings: the modes of network ${key} differ from its modal model`);
}
