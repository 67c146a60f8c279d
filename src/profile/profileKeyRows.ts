import type * as z from "zod";
import { DIMENSIONS } from "../units/dimensions.js";
import { profileKeyMeta } from "./profileKeyMeta.js";
import { profileSchema } from "./profileSchema.js";

/** One key of the duty-profile format, as the profile reference lists it. */
export interface ProfileKeyRow {
  /** dotted path; `[]` marks a list item, `[name]` the variant of a list whose items differ by a key (`parts[].lifetime[lesit].coefficient`) */
  readonly path: string;
  /** what the value is, in words ("quantity", "whole number", "one of: a, b", "list of sections", ...) */
  readonly type: string;
  /** the SI unit a plain number is read in ("" when the value has none or its schema does not say) */
  readonly unit: string;
  /** false when the key may be left out */
  readonly required: boolean;
  /** the example the schema's own error words carry (`such as "3 s"`), if any */
  readonly schemaExample?: string;
  /** the schema that checks this key's value, so an example can be validated against it */
  readonly schema: z.ZodType;
}

// zod 4 schemas carry their kind in `_zod.def.type`; the walk reads only these fields.
interface Def {
  readonly type: string;
  readonly innerType?: z.ZodType;
  readonly in?: z.ZodType;
  readonly element?: z.ZodType;
  readonly items?: readonly z.ZodType[];
  readonly options?: readonly z.ZodType[];
  readonly discriminator?: string;
  readonly entries?: Record<string, string>;
  readonly values?: readonly unknown[];
  readonly shape?: Record<string, z.ZodType>;
}
const defOf = (schema: z.ZodType): Def => (schema as unknown as { _zod: { def: Def } })._zod.def;

/** Strip optional/nullable/default wrappers; `required` is false when one of them was optional. */
function unwrap(schema: z.ZodType): { inner: z.ZodType; optional: boolean; nullable: boolean; lazy?: z.ZodType } {
  let inner = schema;
  let optional = false;
  let nullable = false;
  let lazy: z.ZodType | undefined;
  for (;;) {
    const def = defOf(inner);
    if (def.type === "optional" || def.type === "default") optional = true;
    else if (def.type === "nullable") nullable = true;
    else if (def.type === "pipe" && profileKeyMeta.get(inner) === undefined && def.in !== undefined) {
      inner = def.in; // a transform after a section (`null` → {}): describe the section
      continue;
    } else if (def.type === "lazy") {
      lazy = inner; // zod caches the lazy schema's result in `_zod.innerType`
      inner = (inner as unknown as { _zod: { innerType: z.ZodType } })._zod.innerType;
      continue;
    } else break;
    inner = def.innerType!;
  }
  return { inner, optional, nullable, ...(lazy === undefined ? {} : { lazy }) };
}

/** "such as "3 s"" → 3 s; "such as 0.95" → 0.95. */
function exampleFromWords(words: string): string | undefined {
  const match = /such as ("[^"]*"|[^\s,)]+)/.exec(words);
  return match === null ? undefined : match[1]!.replace(/^"|"$/g, "");
}

/** Type words, unit and example of a leaf (a schema with no keys below it). */
function describeLeaf(schema: z.ZodType): { type: string; unit: string; schemaExample?: string } {
  const meta = profileKeyMeta.get(schema);
  if (meta !== undefined) {
    const unit = meta.kind === "count" ? "" : DIMENSIONS[meta.dimension].si;
    const type = meta.kind === "count" ? "whole number" : meta.kind === "range" ? "quantity, or a [low, high] pair" : "quantity";
    const schemaExample = exampleFromWords(meta.words);
    return { type, unit, ...(schemaExample === undefined ? {} : { schemaExample }) };
  }
  const def = defOf(schema);
  switch (def.type) {
    case "string":
      return { type: "text", unit: "" };
    case "number":
      return { type: "number", unit: "" };
    case "boolean":
      return { type: "true or false", unit: "" };
    case "enum":
      return { type: `one of: ${Object.values(def.entries ?? {}).join(", ")}`, unit: "" };
    case "literal":
      return { type: `"${(def.values ?? []).join('", "')}"`, unit: "" };
    case "record":
      return { type: "section (keys of its own)", unit: "" };
    case "tuple":
      return { type: `[${(def.items ?? []).map((item) => leafWords(item)).join(", ")}]`, unit: "" };
    case "union": {
      const kinds = (def.options ?? []).map((o) => defOf(unwrap(o).inner).type);
      if (kinds.length === 2 && kinds.includes("number") && kinds.includes("string")) return { type: "quantity (number in SI or text with a unit)", unit: "" };
      if (kinds.length === 2 && kinds.includes("string") && kinds.includes("record")) return { type: "file path, or an inline section", unit: "" };
      return { type: `one of: ${(def.options ?? []).map((o) => leafWords(o)).join("; ")}`, unit: "" };
    }
    default:
      return { type: def.type, unit: "" };
  }
}

/** Short words for an item inside a tuple or union: "time (s)". */
function leafWords(schema: z.ZodType): string {
  const { inner } = unwrap(schema);
  const meta = profileKeyMeta.get(inner);
  if (meta !== undefined && meta.kind !== "count") return `${meta.dimension === "temperatureDifference" ? "temperature difference" : meta.dimension} (${DIMENSIONS[meta.dimension].si})`;
  const leaf = describeLeaf(inner);
  return leaf.type;
}

/**
 * Every key of a profile schema, depth first in the schema's own order: sections, their keys,
 * list items (`[]`) and the variants of a discriminated list (`[model]`). A section reached
 * again inside itself (a `repeat`'s `events`) is listed once, with a pointer back. Quantities
 * take their dimension and example from {@link profileKeyMeta}. Source: zod 4's schema
 * definitions (`_zod.def`); keys of our own. Never throws.
 */
export function profileKeyRows(schema: z.ZodType = profileSchema): ProfileKeyRow[] {
  const rows: ProfileKeyRow[] = [];
  const seen = new Map<z.ZodType, string>();
  const visit = (node: z.ZodType, path: string, required: boolean): void => {
    const { inner, optional, nullable, lazy } = unwrap(node);
    const isRequired = required && !optional;
    const def = defOf(inner);
    const earlier = seen.get(inner) ?? (lazy === undefined ? undefined : seen.get(lazy));
    if (earlier !== undefined) {
      rows.push({ path, type: `as \`${earlier}\``, unit: "", required: isRequired, schema: inner });
      return;
    }
    if (def.type === "object" && profileKeyMeta.get(inner) === undefined) {
      seen.set(inner, path);
      if (path !== "") rows.push({ path, type: nullable ? "section (may be empty)" : "section", unit: "", required: isRequired, schema: inner });
      for (const [key, child] of Object.entries(def.shape ?? {})) visit(child, path === "" ? key : `${path}.${key}`, true);
      return;
    }
    if (def.type === "array" && def.element !== undefined) {
      const { inner: element, lazy: lazyElement } = unwrap(def.element);
      const elementDef = defOf(element);
      if (lazyElement !== undefined && seen.has(lazyElement)) {
        rows.push({ path, type: `list of sections, as \`${seen.get(lazyElement)}\``, unit: "", required: isRequired, schema: inner });
        return;
      }
      if (lazyElement !== undefined) seen.set(lazyElement, path);
      if (elementDef.type === "object" && profileKeyMeta.get(element) === undefined) {
        if (seen.has(element)) {
          rows.push({ path, type: `list of sections, as \`${seen.get(element)}\``, unit: "", required: isRequired, schema: inner });
          return;
        }
        rows.push({ path, type: "list of sections", unit: "", required: isRequired, schema: inner });
        seen.set(element, path);
        for (const [key, child] of Object.entries(elementDef.shape ?? {})) visit(child, `${path}[].${key}`, true);
        return;
      }
      const leaf = describeLeaf(element);
      rows.push({ path, type: `list of ${leaf.type}`, unit: leaf.unit, required: isRequired, ...(leaf.schemaExample === undefined ? {} : { schemaExample: leaf.schemaExample }), schema: inner });
      return;
    }
    if (def.type === "union" && def.discriminator !== undefined) {
      const names = (def.options ?? []).map((o) => String(defOf(defOf(o).shape![def.discriminator!]!).values?.[0]));
      rows.push({ path, type: `section, by \`${def.discriminator}\`: ${names.join(", ")}`, unit: "", required: isRequired, schema: inner });
      for (const [i, option] of (def.options ?? []).entries()) {
        for (const [key, child] of Object.entries(defOf(option).shape ?? {})) {
          if (key !== def.discriminator) visit(child, `${path}[${names[i]}].${key}`, true);
        }
      }
      return;
    }
    const leaf = describeLeaf(inner);
    rows.push({ path, ...leaf, required: isRequired, schema: inner });
  };
  visit(schema, "", true);
  return rows;
}
