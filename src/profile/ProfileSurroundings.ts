import type { PiecewiseLinearSeries } from "../thermal/PiecewiseLinearSeries.js";

/** Extra heat on a node of a part's network (another machine's losses on a shared heatsink). */
export interface ProfileHeatSource {
  /** the profile field it came from (`heatSources[0]`), for messages */
  readonly field: string;
  readonly label?: string;
  /** the part whose network holds the node (every part of that network feels it) */
  readonly partIndex: number;
  /** the node of that network (graph node name, or a Cauer ladder's node name) */
  readonly node: string;
  /** the power [W] as a function of profile time */
  readonly powerW: PiecewiseLinearSeries;
}

/**
 * The world around the parts when it is not a constant ambient: the ambient as a time series
 * (°C, profile time) and extra heat sources on network nodes. Parts' `ambientC` is then the
 * ambient at time 0, and every rise is counted from it. Convention (docs/profile-format.md,
 * "Ambient that varies"): on a graph or Cauer network the ambient enters through the links to
 * ambient and every node follows it through the network's own heat capacities; on a Foster
 * network (not physical nodes) the part follows the ambient at once.
 */
export interface ProfileSurroundings {
  /** the ambient [°C] over profile time; undefined: constant at every part's ambientC */
  readonly ambientC?: PiecewiseLinearSeries;
  /** what the ambient description was, for reports ("daily 18–34 °C, maximum at 15 h") */
  readonly ambientWords?: string;
  readonly heatSources: readonly ProfileHeatSource[];
}
