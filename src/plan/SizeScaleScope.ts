/**
 * What `heatledger size` scales to find the smallest heat capacity of a part:
 * - `whole`: every heat capacity of the part's network (element, housing, heatsink: the whole
 *   thermal body) times k, every thermal resistance kept, as if the whole part were built k times
 *   larger in mass with the same paths for heat;
 * - `element`: only the element's capacity, the one the part's own power meets first (C1 of a
 *   Cauer ladder or lumped element, the part's source node of a graph, C1 of the exact Cauer
 *   ladder of a Foster network), the rest of the network as it is.
 * The default is SIZE_DEFAULTS.scale.
 */
export const SIZE_SCALE_SCOPES = ["whole", "element"] as const;

/** One of {@link SIZE_SCALE_SCOPES}. */
export type SizeScaleScope = (typeof SIZE_SCALE_SCOPES)[number];
