import { InputError, describeFound, inputError, withLocation } from "../errors/InputError.js";
import { FieldReader, join } from "../format/FieldReader.js";
import { parseStructuredText } from "../format/parseStructuredText.js";
import type { ModalModel } from "../thermal/ModalModel.js";
import { observedIndex, sourceIndex } from "../thermal/ModalModel.js";
import { type ThermalNetwork, networkToModal } from "../thermal/ThermalNetwork.js";
import type { NetworkPart } from "../thermal/NetworkPart.js";
import { parseNetwork } from "../thermal/parseNetwork.js";
import type { CircuitRole, ProfilePart } from "./DutyProfile.js";
import { type CircuitInput, type PartInput, ROLE_NAMES } from "./profileSchema.js";
import { type StressConfig, resolveStressConfig } from "../stress/resolveStressConfig.js";
import { stressPartKind } from "./stressPartKind.js";
import { resolveRatingSeries } from "./resolveRatingSeries.js";
import { PROFILE_DEFAULTS } from "./profileDefaults.js";
import type { ReadNamedFile } from "./ReadNamedFile.js";
import { TOPOLOGY_ROLES } from "./resolveProfileCircuit.js";

/*
 * A profile's parts: each part's network read through the caller's file reader, named after the
 * part's role, reduced to its modal form, with its limits and stress keys resolved.
 * Part of loading a profile (loadProfile.ts orchestrates).
 */
export function resolvePart(
  reader: FieldReader,
  part: PartInput,
  field: string,
  ambientC: number,
  topology: CircuitInput["topology"] | undefined,
  file: string,
  lineOf: (field: string) => number,
  readFile: ReadNamedFile | undefined,
  networks: Map<string, ResolvedNetwork | undefined>,
): ProfilePart | undefined {
  const role = part.role === undefined ? undefined : ROLE_NAMES[part.role];
  if (role !== undefined) {
    if (topology === undefined) reader.fail("bad-profile", join(field, "role"), "a `circuit` section for the part's role to refer to (or no role)", describeFound(part.role));
    else if (!TOPOLOGY_ROLES[topology].includes(role)) {
      const names = Object.entries(ROLE_NAMES).filter(([, r]) => TOPOLOGY_ROLES[topology].includes(r)).map(([n]) => n);
      reader.fail("bad-profile", join(field, "role"), `a role of a ${topology} circuit (${names.join(", ")})`, describeFound(part.role));
    }
  }
  const margin = part.limits.margin ?? PROFILE_DEFAULTS.marginK;
  if (part.limits.maxTemperature <= (part.ambient ?? ambientC))
    reader.fail("out-of-range", join(field, "limits.maxTemperature"), `a limit above the ambient (${part.ambient ?? ambientC} °C)`, `${part.limits.maxTemperature} °C`);
  const networkKey = typeof part.network === "string" ? part.network : join(field, "network");
  const resolved = networks.has(networkKey) ? networks.get(networkKey) : resolveNetwork(reader, part, role, field, file, lineOf, readFile);
  networks.set(networkKey, resolved);
  let stress: StressConfig | undefined;
  try {
    stress = resolveStressConfig(resolveRatingSeries(part, field, readFile), { field, partKind: stressPartKind(role), limitC: part.limits.maxTemperature });
  } catch (error) {
    reader.absorb(error);
  }
  if (resolved === undefined) return undefined;
  const { model, network } = resolved;
  try {
    const sourceAt = part.source === undefined ? 0 : sourceIndex(model, part.source, join(field, "source"));
    const observedAt = part.observe === undefined ? 0 : observedIndex(model, part.observe, join(field, "observe"));
    return {
      id: part.id,
      ...(role === undefined ? {} : { role }),
      model,
      networkKey,
      network,
      sourceIndex: sourceAt,
      observedIndex: observedAt,
      ambientC: part.ambient ?? ambientC,
      limitC: part.limits.maxTemperature,
      marginK: margin,
      ...(stress === undefined ? {} : { stress }),
    };
  } catch (error) {
    reader.absorb(error);
    return undefined;
  }
}

/** The part a network of a circuit role describes: its nodes are named after it (src/thermal/NetworkPart.ts). */
const ROLE_NETWORK_PARTS: Readonly<Record<CircuitRole, NetworkPart>> = { resistor: "resistor", sourceResistor: "resistor", mosfet: "semiconductor", switch: "semiconductor" };

/**
 * A ladder network named after the role of the part it heats: its `part` set from the role when
 * the network does not say; refused when it says another part. Graphs name their own nodes.
 * @throws InputError `bad-network` for a ladder whose `part` contradicts the role
 */
function namedForRole(network: ThermalNetwork, role: CircuitRole | undefined, field: string): ThermalNetwork {
  if (network.kind === "graph" || role === undefined) return network;
  const part = ROLE_NETWORK_PARTS[role];
  if (network.part === undefined) return { ...network, part };
  const roleWord = Object.entries(ROLE_NAMES).find(([, r]) => r === role)![0];
  if (network.part !== part) throw inputError("bad-network", join(field, "part"), `part: ${part} (the network of a part whose role is ${roleWord}), or no part key`, describeFound(network.part));
  return network;
}

/** A part's network as written and its modal form. */
export interface ResolvedNetwork {
  readonly model: ModalModel;
  readonly network: ThermalNetwork;
}

function resolveNetwork(
  reader: FieldReader,
  part: PartInput,
  role: CircuitRole | undefined,
  field: string,
  file: string,
  lineOf: (field: string) => number,
  readFile: ReadNamedFile | undefined,
): ResolvedNetwork | undefined {
  const at = join(field, "network");
  let network: ThermalNetwork;
  let model: ModalModel;
  try {
    if (typeof part.network === "string") {
      if (readFile === undefined) {
        reader.fail("bad-file", at, "an inline network (this caller cannot read files)", describeFound(part.network));
        return undefined;
      }
      let text: string;
      try {
        text = readFile(part.network);
      } catch (error) {
        reader.fail("bad-file", at, "a readable network file", `${describeFound(part.network)} (${whyUnreadable(error, readFile.displayName?.(part.network))})`);
        return undefined;
      }
      let doc: ReturnType<typeof parseStructuredText> | undefined;
      try {
        doc = parseStructuredText(text, readFile.displayName?.(part.network) ?? part.network);
        network = namedForRole(parseNetwork(doc.data, ""), role, "");
        model = networkToModal(network, "");
      } catch (error) {
        if (!(error instanceof InputError)) throw error;
        reader.absorb(withLocation(error, readFile.displayName?.(part.network) ?? part.network, "", doc?.lineOf));
        return undefined;
      }
    } else {
      network = namedForRole(parseNetwork(part.network, at), role, at);
      model = networkToModal(network, at);
    }
  } catch (error) {
    if (error instanceof InputError) {
      const located = withLocation(error, file, "", lineOf);
      for (const p of located.problems) reader.fail(p.code, p.field, p.expected, p.found);
      return undefined;
    }
    throw error;
  }
  return { model, network };
}

/** Why a named file could not be read, in a few words ("no such file: /a/b.yaml"). */
export function whyUnreadable(error: unknown, shownAs: string | undefined): string {
  const reason = error instanceof InputError ? (error.problems[0]?.found ?? "unreadable") : error instanceof Error ? error.message.split("\n")[0]! : "unreadable";
  return shownAs === undefined ? reason : `${reason}: ${shownAs}`;
}
