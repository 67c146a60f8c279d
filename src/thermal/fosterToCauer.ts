import type { Fraction } from "mathjs";
import { describeFound, inputError } from "../errors/InputError.js";
import { loadMathjs } from "../units/loadMathjs.js";
import type { CauerLadder, CauerStage } from "./cauerLadder.js";
import { cauerToModal } from "./cauerLadder.js";
import { type FosterNetwork, fosterToModal, validateFoster } from "./fosterNetwork.js";
import { zth, logSpacedTimes } from "./zth.js";

/**
 * Largest relative difference allowed between the Zth of a Foster network and the Zth of the
 * Cauer ladder synthesised from it (checked at {@link FOSTER_TO_CAUER_CHECK_TIMES} log-spaced
 * times). The synthesis is exact; what can fail is the last step, rounding the exact ladder to
 * double precision, when the time constants are so close or so far apart that the ladder is
 * ill-conditioned.
 */
export const FOSTER_TO_CAUER_ROUND_TRIP_TOLERANCE = 1e-6;

/** Number of log-spaced times (from fastest tau / 1000 to slowest tau × 1000) of the round-trip check. */
export const FOSTER_TO_CAUER_CHECK_TIMES = 50;

type FractionConstructor = new (numerator: bigint, denominator: bigint) => Fraction;

/**
 * Foster → Cauer conversion by continued-fraction expansion of the input admittance, in exact
 * rational arithmetic, with a round-trip check.
 *
 * The Foster impedance Z(s) = Σ_i R_i/(1 + s·tau_i) is written as N(s)/D(s) with
 * D(s) = Π_i (1 + s·tau_i) (degree n) and N(s) = Σ_i R_i·Π_{j≠i}(1 + s·tau_j) (degree n − 1).
 * The admittance Y = D/N of a Cauer ladder (C_1 to the reference at the junction, R_1 to node 2,
 * C_2, ..., R_n to ambient) is the continued fraction
 *   Y(s) = s·C_1 + 1/(R_1 + 1/(s·C_2 + 1/(R_2 + ... + 1/(s·C_n + 1/R_n)))),
 * so, starting from P = D, Q = N and repeating n times:
 *   C_k = lead(P)/lead(Q);  P ← P − s·C_k·Q  (degree drops to deg Q);
 *   R_k = lead(Q)/lead(P);  Q ← Q − R_k·P    (degree drops below deg P).
 * Every double input is turned into an exact fraction (mantissa/2^exponent) and the whole
 * expansion runs in mathjs Fraction (BigInt) arithmetic, so the only rounding is the final
 * conversion of each R_k, C_k to a double. Stages with exactly equal tau are merged first (they are
 * one pole). Consequences used as checks: Σ R_k = Σ R_i (Z(0)); C_1 = 1/Σ(1/C_i) with
 * C_i = tau_i/R_i (the high-frequency limit Y ≈ s·C_1).
 * Round trip: the ladder is turned back into a Foster form through the exact eigen route
 * (cauerToModal) and both Zth curves are compared at {@link FOSTER_TO_CAUER_CHECK_TIMES} log-spaced
 * times; a difference above {@link FOSTER_TO_CAUER_ROUND_TRIP_TOLERANCE} (relative) is an error.
 * Source: Foster, "A reactance theorem", Bell System Technical Journal 3 (1924); Cauer, "Die
 * Verwirklichung von Wechselstromwiderständen vorgeschriebener Frequenzabhängigkeit", Archiv für
 * Elektrotechnik 17 (1926) (continued-fraction synthesis of RC one-ports); JEDEC JESD51-14 (2010),
 * annex on Foster and Cauer networks.
 * Validity: any Foster network with R_i > 0, tau_i > 0 (a positive-real RC impedance, so every
 * R_k, C_k comes out positive).
 * Cost: O(n²) fraction operations on numbers whose size grows with n (fine up to a few tens of
 * stages); the round-trip check costs O(n³).
 * @throws InputError `bad-network` for an invalid Foster network, or when the rounded ladder fails
 *   the round-trip check (time constants too close together or too far apart for double precision)
 * @example
 * fosterToCauer({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }, { rKPerW: 1.5, tauS: 2 }] }).stages.length // => 2
 */
export function fosterToCauer(network: FosterNetwork, field = "network"): CauerLadder {
  validateFoster(network, field);
  const FractionClass = (loadMathjs() as unknown as { Fraction: FractionConstructor }).Fraction;
  const exact = (x: number): Fraction => {
    const [numerator, denominator] = exactRatio(x);
    return new FractionClass(numerator, denominator);
  };
  // Merge stages with exactly equal tau: they are one pole with the summed residue.
  const merged = new Map<number, number>();
  for (const stage of network.stages) merged.set(stage.tauS, (merged.get(stage.tauS) ?? 0) + stage.rKPerW);
  const poles = [...merged.entries()].map(([tau, r]) => ({ tau: exact(tau), r: exact(r) }));
  const zero = new FractionClass(0n, 1n);
  const one = new FractionClass(1n, 1n);
  // Polynomials as coefficient arrays, index = power of s.
  let d: Fraction[] = [one];
  for (const pole of poles) d = multiplyLinear(d, pole.tau, zero);
  let nPoly: Fraction[] = [zero];
  poles.forEach((pole, i) => {
    let term: Fraction[] = [pole.r];
    poles.forEach((other, j) => {
      if (j !== i) term = multiplyLinear(term, other.tau, zero);
    });
    nPoly = addPoly(nPoly, term, zero);
  });
  let p = trim(d);
  let q = trim(nPoly);
  const stages: CauerStage[] = [];
  for (let k = 0; k < poles.length; k++) {
    const c = lead(p).div(lead(q));
    // P ← P − s·C·Q
    const sq = [zero, ...q.map((x) => x.mul(c))];
    p = trim(subPoly(p, sq, zero));
    const r = lead(q).div(lead(p));
    q = trim(subPoly(q, p.map((x) => x.mul(r)), zero));
    stages.push({ rKPerW: fractionToNumber(r), cJPerK: fractionToNumber(c) });
  }
  // the same part: its nodes keep their role's names (src/thermal/NetworkPart.ts)
  const ladder: CauerLadder = { kind: "cauer", stages, ...(network.part === undefined ? {} : { part: network.part }) };
  checkRoundTrip(network, ladder, field);
  return ladder;
}

/** (1 + s·tau)·poly */
function multiplyLinear(poly: readonly Fraction[], tau: Fraction, zero: Fraction): Fraction[] {
  const out = new Array<Fraction>(poly.length + 1).fill(zero);
  poly.forEach((c, i) => {
    out[i] = out[i]!.add(c);
    out[i + 1] = out[i + 1]!.add(c.mul(tau));
  });
  return out;
}

function addPoly(a: readonly Fraction[], b: readonly Fraction[], zero: Fraction): Fraction[] {
  return Array.from({ length: Math.max(a.length, b.length) }, (_, i) => (a[i] ?? zero).add(b[i] ?? zero));
}

function subPoly(a: readonly Fraction[], b: readonly Fraction[], zero: Fraction): Fraction[] {
  return Array.from({ length: Math.max(a.length, b.length) }, (_, i) => (a[i] ?? zero).sub(b[i] ?? zero));
}

/** Drop exactly-zero leading coefficients. */
function trim(poly: Fraction[]): Fraction[] {
  let n = poly.length;
  while (n > 1 && poly[n - 1]!.n === 0n) n--;
  return poly.slice(0, n);
}

function lead(poly: readonly Fraction[]): Fraction {
  return poly[poly.length - 1]!;
}

/**
 * A finite double as an exact ratio of BigInts: x = numerator/denominator with denominator a power of 2.
 */
function exactRatio(x: number): [bigint, bigint] {
  if (!Number.isFinite(x)) throw new RangeError(`exactRatio needs a finite number, got ${x}`);
  if (x === 0) return [0n, 1n];
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  const bits = view.getBigUint64(0);
  const sign = bits >> 63n === 1n ? -1n : 1n;
  const exponentBits = Number((bits >> 52n) & 0x7ffn);
  const fraction = bits & 0xfffffffffffffn;
  const mantissa = exponentBits === 0 ? fraction : fraction | 0x10000000000000n;
  const exponent = (exponentBits === 0 ? 1 : exponentBits) - 1075;
  if (exponent >= 0) return [sign * (mantissa << BigInt(exponent)), 1n];
  return [sign * mantissa, 1n << BigInt(-exponent)];
}

/** Correctly scaled conversion of a fraction of arbitrary size to the nearest double (to about 1 ulp). */
function fractionToNumber(f: Fraction): number {
  const n = f.n;
  const d = f.d;
  if (n === 0n) return 0;
  // Scale so the integer quotient carries 64 significant bits, then undo the scale in floating point.
  const shift = 64 - (n.toString(2).length - d.toString(2).length);
  const q = shift >= 0 ? (n << BigInt(shift)) / d : n / (d << BigInt(-shift));
  const sign = f.s < 0n ? -1 : 1;
  return sign * Number(q) * 2 ** -shift;
}

/** Compare the Foster and Cauer Zth at log-spaced times; throw when they differ. */
function checkRoundTrip(network: FosterNetwork, ladder: CauerLadder, field: string): void {
  ladder.stages.forEach((s, k) => {
    if (!(s.rKPerW > 0) || !(s.cJPerK > 0) || !Number.isFinite(s.rKPerW) || !Number.isFinite(s.cJPerK))
      throw inputError("bad-network", `${field}.stages`, "time constants that give a Cauer ladder representable in double precision", `stage ${k + 1} with R = ${s.rKPerW}, C = ${s.cJPerK}`);
  });
  const foster = fosterToModal(network, field);
  const cauer = cauerToModal(ladder, field);
  const taus = foster.tauS;
  const times = logSpacedTimes(Math.min(...taus) * 1e-3, Math.max(...taus) * 1e3, FOSTER_TO_CAUER_CHECK_TIMES);
  let worst = 0;
  for (const t of times) {
    const expected = zth(foster, t);
    worst = Math.max(worst, Math.abs(zth(cauer, t) - expected) / expected);
  }
  if (!(worst <= FOSTER_TO_CAUER_ROUND_TRIP_TOLERANCE))
    throw inputError(
      "bad-network",
      `${field}.stages`,
      `time constants whose Cauer form round-trips within ${FOSTER_TO_CAUER_ROUND_TRIP_TOLERANCE} relative`,
      `a round-trip difference of ${describeFound(worst)}`,
    );
}
