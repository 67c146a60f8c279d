import { describeFound, inputError } from "../errors/InputError.js";

/**
 * The one engine representation of a linear RC thermal network (see docs/engine.md, "The modal form").
 *
 * Every mode m has a time constant tauS[m]. Each heat source s drives its own copy of every mode,
 * a state y[s][m] in watts that follows the first-order low-pass
 *   dy/dt = (P_s(t) − y) / tau_m,
 * and the rise of observed node o over ambient is
 *   rise_o(t) = Σ_s Σ_m gainKPerW[o][s][m] · y[s][m](t)   [K].
 * A step of power P at source s therefore gives rise_o(t) = P · Σ_m gain[o][s][m]·(1 − e^(−t/tau_m)),
 * i.e. the gains are the Foster resistances of the transfer impedance Zth_{o,s}(t).
 */
export interface ModalModel {
  /** time constant of each mode [s], all > 0 */
  readonly tauS: readonly number[];
  /** names of the heat sources (the parts or nodes power is injected into) */
  readonly sources: readonly string[];
  /** names of the observed nodes */
  readonly observed: readonly string[];
  /** gains [K/W], indexed [observed][source][mode] */
  readonly gainKPerW: readonly (readonly (readonly number[])[])[];
}

/**
 * Check a modal model's shape and values.
 * @throws InputError `bad-network`
 */
export function validateModalModel(model: ModalModel, field = "network"): void {
  const modes = model.tauS.length;
  model.tauS.forEach((tau, m) => {
    if (!(tau > 0) || !Number.isFinite(tau)) throw inputError("bad-network", `${field}.tauS[${m}]`, "a finite time constant > 0 s", describeFound(tau));
  });
  if (model.gainKPerW.length !== model.observed.length)
    throw inputError("bad-network", `${field}.gainKPerW`, `${model.observed.length} observed rows`, String(model.gainKPerW.length));
  model.gainKPerW.forEach((row, o) => {
    if (row.length !== model.sources.length)
      throw inputError("bad-network", `${field}.gainKPerW[${o}]`, `${model.sources.length} source rows`, String(row.length));
    row.forEach((gains, s) => {
      if (gains.length !== modes) throw inputError("bad-network", `${field}.gainKPerW[${o}][${s}]`, `${modes} gains`, String(gains.length));
      gains.forEach((g, m) => {
        if (!Number.isFinite(g)) throw inputError("bad-network", `${field}.gainKPerW[${o}][${s}][${m}]`, "a finite gain in K/W", describeFound(g));
      });
    });
  });
}

/** Index of a named source, or a clear error. */
export function sourceIndex(model: ModalModel, name: string, field = "source"): number {
  const i = model.sources.indexOf(name);
  if (i < 0) throw inputError("bad-network", field, `one of the network's heat sources (${model.sources.join(", ")})`, describeFound(name));
  return i;
}

/** Index of a named observed node, or a clear error. */
export function observedIndex(model: ModalModel, name: string, field = "observe"): number {
  const i = model.observed.indexOf(name);
  if (i < 0) throw inputError("bad-network", field, `one of the network's observed nodes (${model.observed.join(", ")})`, describeFound(name));
  return i;
}

/**
 * Steady-state thermal resistance from source s to observed node o: Σ_m gain [K/W].
 * @example
 * const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }, { rKPerW: 1.5, tauS: 2 }] });
 * steadyStateResistance(model) // => 2
 */
export function steadyStateResistance(model: ModalModel, o = 0, s = 0): number {
  let sum = 0;
  for (const g of model.gainKPerW[o]![s]!) sum += g;
  return sum;
}
