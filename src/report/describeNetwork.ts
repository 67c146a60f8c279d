import type { ModalModel } from "../thermal/ModalModel.js";
import type { ThermalNetwork } from "../thermal/ThermalNetwork.js";
import { logSpacedTimes, zth } from "../thermal/zth.js";

/** What `network show` reports for one (source, observed) pair. */
export interface NetworkPairDescription {
  readonly source: string;
  readonly observed: string;
  readonly totalRthKPerW: number;
  /** the modal (Foster) stages of this transfer impedance, fastest first */
  readonly foster: readonly { readonly rKPerW: number; readonly tauS: number }[];
  readonly zth: readonly { readonly timeS: number; readonly zthKPerW: number }[];
}

/** A network's description: its form, modes and every transfer impedance. */
export interface NetworkDescription {
  readonly form: ThermalNetwork["kind"];
  readonly modes: number;
  readonly pairs: readonly NetworkPairDescription[];
}

/**
 * Describe a network for reports: per (source, observed) pair the modal Foster stages, the total
 * Rth and Zth at log-spaced times from tau_min/100 to 5·tau_max (where Zth has settled to within
 * e^-5 ≈ 0.7 % of Rth). Cost O(pairs × (modes + rows × modes)).
 * @example
 * const network = { kind: "foster", stages: [{ rKPerW: 0.5, tauS: 0.01 }, { rKPerW: 1.5, tauS: 2 }] };
 * describeNetwork(network, networkToModal(network), 5).pairs[0].totalRthKPerW // => 2
 */
export function describeNetwork(network: ThermalNetwork, model: ModalModel, rows: number): NetworkDescription {
  const from = Math.min(...model.tauS) / 100;
  const to = Math.max(...model.tauS) * 5;
  const times = logSpacedTimes(from, to, rows);
  const pairs: NetworkPairDescription[] = [];
  model.observed.forEach((observed, o) =>
    model.sources.forEach((source, s) => {
      const gains = model.gainKPerW[o]![s]!;
      pairs.push({
        source,
        observed,
        totalRthKPerW: gains.reduce((a, b) => a + b, 0),
        foster: model.tauS.map((tauS, m) => ({ rKPerW: gains[m]!, tauS })).sort((a, b) => a.tauS - b.tauS),
        zth: times.map((timeS) => ({ timeS, zthKPerW: zth(model, timeS, o, s) })),
      });
    }),
  );
  return { form: network.kind, modes: model.tauS.length, pairs };
}
