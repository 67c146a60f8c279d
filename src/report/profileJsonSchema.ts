// The duty-profile format as a JSON Schema, for editors that complete and check keys while a
// profile is written (a YAML language server reads the `# yaml-language-server: $schema=...` line
// at the top of a profile). It is generated from the zod schema itself with zod 4's converter,
// so it follows every key that is added or renamed.
//
// Choices:
// - `io: "input"`: the schema describes what a user writes in YAML, before the transforms that
//   turn quantities into SI numbers and an empty `power-up:` into `{}`.
// - Draft-07 output: the draft YAML language servers have read longest.
// - Quantities, counts and ranges are zod transforms of `unknown` that no JSON Schema keyword can
//   follow (a unit string is checked by parsing it). The profile key registry says what each one
//   is, so the schema says "a number or a unit string", "a whole number" or "one value or a pair"
//   and carries the same words the error messages use. Units, dimensions and ranges
//   (`above 0`, `at most ...`) are left to heatledger's own check.
// - An `events` item holds exactly one event key (a zod refinement): that one is expressed, with
//   `minProperties`/`maxProperties` on the event object.
// So the JSON Schema accepts every profile the zod schema accepts, and rejects misspelt or
// unknown keys, missing required keys and wrong kinds of value; it does not check units or
// ranges. See docs/profile-format.md.
import * as z from "zod";
import { EVENT_KEYS, profileSchema } from "../profile/profileSchema.js";
import { profileKeyMeta } from "../profile/profileKeyMeta.js";

type JsonSchemaNode = Record<string, unknown>;

const NUMBER_OR_UNIT = [{ type: "number" }, { type: "string" }];

/** Makes the JSON Schema node of one zod schema say what the profile key registry knows of it. */
function describeKey(zodSchema: z.core.$ZodType, node: JsonSchemaNode): void {
  const meta = profileKeyMeta.get(zodSchema);
  if (meta !== undefined) {
    node.description = meta.words;
    if (meta.kind === "quantity") node.anyOf = NUMBER_OR_UNIT;
    else if (meta.kind === "count") node.type = "integer";
    else node.anyOf = [...NUMBER_OR_UNIT, { type: "array", items: { anyOf: NUMBER_OR_UNIT }, minItems: 1, maxItems: 2 }];
    return;
  }
  const properties = node.properties as JsonSchemaNode | undefined;
  if (node.type === "object" && properties !== undefined && Object.keys(properties).join() === EVENT_KEYS.join()) {
    node.description = `exactly one event key (${EVENT_KEYS.join(", ")})`;
    node.minProperties = 1;
    node.maxProperties = 1;
  }
}

/**
 * The text of docs/profile.schema.json: the duty-profile format as a draft-07 JSON Schema, made
 * from `profileSchema` by zod's `z.toJSONSchema` for the input side (what a user writes), with
 * quantities as "a number or a unit string" and each event holding exactly one key.
 * Source: JSON Schema draft-07 (json-schema.org); zod 4 `z.toJSONSchema`. Validity: keys, required
 * keys and kinds of value; units and numeric ranges are checked by loadProfile only. Never throws.
 */
export function profileJsonSchemaText(): string {
  const schema = z.toJSONSchema(profileSchema, {
    target: "draft-7",
    io: "input",
    unrepresentable: "any",
    cycles: "ref",
    override: (ctx) => describeKey(ctx.zodSchema, ctx.jsonSchema as JsonSchemaNode),
  }) as JsonSchemaNode;
  const body = { ...schema, title: "heatledger duty profile", description: "A duty profile for heatledger (docs/profile-format.md)." };
  let text = JSON.stringify(body, null, 2);
  // The converter numbers the recursive event schema; give it its name.
  for (const name of Object.keys((schema.definitions ?? {}) as JsonSchemaNode)) {
    if (name.startsWith("__schema")) text = text.replaceAll(`"${name}"`, '"event"').replaceAll(`"#/definitions/${name}"`, '"#/definitions/event"');
  }
  return `${text}\n`;
}
