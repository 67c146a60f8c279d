import { describeFound, inputError } from "../errors/InputError.js";
import type { FosterNetwork, FosterStage } from "./fosterNetwork.js";
import type { ModalModel } from "./ModalModel.js";

/**
 * Modes whose gain is below this fraction of the total resistance are dropped by
 * {@link modalToFoster}: they are modes the observed node cannot see (symmetry of the network),
 * whose computed gain is rounding noise of either sign.
 */
export const UNOBSERVABLE_GAIN_FRACTION = 1e-12;

/**
 * The Foster network of a modal model's transfer impedance from a source to an observed node
 * (by default the model's only source and only observed node), stages sorted by ascending tau.
 *
 * This completes the exact Cauer → Foster route: cauerToModal (or graphToModal) solves the
 * symmetric eigenproblem, whose modes are the Foster stages,
 *   Zth(t) = Σ_m gain_m·(1 − e^(−t/tau_m)),  R_m = gain_m,  tau_m as is.
 * Source: JEDEC JESD51-14 (2010), annex on Foster and Cauer networks; Golub & Van Loan, Matrix
 * Computations, 4th ed. (2013), §8.1 (spectral decomposition).
 * Validity: a driving-point impedance (observed node = source node) always has positive gains; a
 * transfer impedance between different nodes may have negative ones and is then not a Foster network.
 * Cost O(modes·log modes).
 * @throws InputError `bad-network` when the model has several sources or observed nodes and no
 *   choice is given, or when a gain is negative (not representable as a Foster network)
 * @example
 * const model = cauerToModal({ kind: "cauer", stages: [{ rKPerW: 0.5, cJPerK: 0.02 }, { rKPerW: 1.5, cJPerK: 1 }] });
 * modalToFoster(model).stages.map((s) => s.tauS) // => [0.009803, 1.530]
 */
export function modalToFoster(model: ModalModel, observed?: string, source?: string, field = "network"): FosterNetwork {
  const o = pick(model.observed, observed, `${field}.observed`);
  const s = pick(model.sources, source, `${field}.sources`);
  const gains = model.gainKPerW[o]![s]!;
  const total = gains.reduce((a, b) => a + b, 0);
  const stages: FosterStage[] = [];
  gains.forEach((g, m) => {
    if (Math.abs(g) <= UNOBSERVABLE_GAIN_FRACTION * Math.abs(total)) return;
    if (g < 0) throw inputError("bad-network", `${field}.gainKPerW[${o}][${s}][${m}]`, "a positive gain (a Foster network has R > 0)", describeFound(g));
    stages.push({ rKPerW: g, tauS: model.tauS[m]! });
  });
  if (stages.length === 0) throw inputError("bad-network", `${field}.gainKPerW[${o}][${s}]`, "at least one mode coupling source and observed node", "none");
  stages.sort((a, b) => a.tauS - b.tauS);
  return { kind: "foster", stages };
}

function pick(names: readonly string[], name: string | undefined, field: string): number {
  if (name === undefined) {
    if (names.length !== 1) throw inputError("bad-network", field, "a model with exactly one entry, or a name to pick", describeFound(names));
    return 0;
  }
  const i = names.indexOf(name);
  if (i < 0) throw inputError("bad-network", field, `one of ${names.join(", ")}`, describeFound(name));
  return i;
}
