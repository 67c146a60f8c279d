import * as z from "zod";
import type { Dimension } from "../units/dimensions.js";

/**
 * What a profile key's validating schema cannot say by its zod type alone: a quantity's physical
 * dimension (its SI unit comes from DIMENSIONS), a whole count, or a range of a quantity, with the
 * words its error message uses (they carry an example a user can copy).
 */
export type ProfileKeyMeta =
  | { readonly kind: "quantity"; readonly dimension: Dimension; readonly words: string }
  | { readonly kind: "range"; readonly dimension: Dimension; readonly words: string }
  | { readonly kind: "count"; readonly words: string };

/**
 * The registry the profile schema's field builders write {@link ProfileKeyMeta} into, so the
 * profile reference (`profileKeyRows`) can name each key's type and unit from the schema itself.
 * Source: zod 4 registries (`z.registry`, `schema.register`); keys of our own. Never throws.
 */
export const profileKeyMeta = z.registry<ProfileKeyMeta>();
