import { inputError } from "../../errors/InputError.js";
import { formatCautions, reportCautions, wrapText } from "../../text/cautions.js";
import { describeNetwork } from "../../report/describeNetwork.js";
import { formatDuration, formatNumber, formatTable } from "../../text/formatTable.js";
import { lineChart } from "../../report/lineChart.js";
import { cauerToModal } from "../../thermal/cauerLadder.js";
import { networkToDocument } from "../../thermal/formatNetworkFile.js";
import { type LumpedMass, lumpedNetwork } from "../../thermal/lumpedNetwork.js";
import { MATERIALS, type MaterialPreset, materialPreset } from "../../thermal/materials.js";
import type { ThermalNetwork } from "../../thermal/ThermalNetwork.js";
import { logSpacedTimes, zth } from "../../thermal/zth.js";
import { parseQuantity } from "../../units/parseQuantity.js";
import type { CliRun } from "../main.js";
import { emitNetwork } from "./emitNetwork.js";
import { LUMPED_FORMS, type LumpedFlags } from "./networkLumped.js";

/**
 * The run of `heatledger network lumped` (flags and help are in networkLumped.ts, which loads this
 * module only when the command runs): build the one- or two-stage ladder from the masses,
 * materials and resistances, print the report and write or print the network file.
 * @throws InputError for a missing or bad flag, or an --out file that exists without --force
 */
export function networkLumpedAction(run: CliRun, options: LumpedFlags): void {
  const form = options.form.toLowerCase();
  if (!(LUMPED_FORMS as readonly string[]).includes(form)) throw inputError("bad-option", "--form", `one of ${LUMPED_FORMS.join(", ")}`, JSON.stringify(options.form));
  const element = readLump(options.mass, options.material, options.specificHeat, "");
  const rToAmbientKPerW = required(options.rAmbient, "thermalResistance", "--r-ambient", "the resistance to ambient, such as \"12 K/W\"");
  const hasBody = options.bodyMass !== undefined || options.bodyMaterial !== undefined || options.bodySpecificHeat !== undefined || options.rBody !== undefined;
  const body = hasBody ? readLump(options.bodyMass, options.bodyMaterial, options.bodySpecificHeat, "body-") : undefined;
  const rBody = hasBody ? required(options.rBody, "thermalResistance", "--r-body", "the resistance from the element to the body, such as \"2 K/W\"") : 0;
  const ladder = lumpedNetwork(
    { element: element.lump, rToAmbientKPerW, ...(body === undefined ? {} : { body: { ...body.lump, rElementToBodyKPerW: rBody } }) },
    "lumped",
  );
  const model = cauerToModal(ladder);
  const described = describeNetwork(ladder, model, 13).pairs[0]!;
  const written: ThermalNetwork = form === "foster" ? { kind: "foster", part: "resistor", stages: described.foster } : ladder;
  const emitted = emitNetwork(run, written, options);
  const presets = [element.preset, body?.preset].filter((p): p is MaterialPreset => p !== undefined);
  if (options.json) {
    const json = {
      form,
      network: networkToDocument(written, options.name),
      lumps: [{ role: "element", ...element.lump, cJPerK: ladder.stages[0]!.cJPerK }, ...(body === undefined ? [] : [{ role: "body", ...body.lump, cJPerK: ladder.stages[1]!.cJPerK }])],
      foster: described.foster,
      totalRthKPerW: described.totalRthKPerW,
      materials: presets,
      written: emitted.written,
      cautions: reportCautions(false),
    };
    run.io.out(`${JSON.stringify(json, null, 2)}\n`);
    return;
  }
  const lumps = [["element", element, ladder.stages[0]!] as const, ...(body === undefined ? [] : [["body", body, ladder.stages[1]!] as const])];
  const from = Math.min(...model.tauS) / 100;
  const to = Math.max(...model.tauS) * 5;
  const out = [
    `Lumped network, ${ladder.stages.length} stage${ladder.stages.length === 1 ? "" : "s"}: total Rth = ${formatNumber(described.totalRthKPerW)} K/W`,
    formatTable(
      [{ heading: "lump" }, { heading: "mass", align: "right" }, { heading: "c [J/(kg K)]", align: "right" }, { heading: "C [J/K]", align: "right" }, { heading: "then R [K/W]", align: "right" }, { heading: "material" }],
      lumps.map(([role, l, stage]) => [role, `${formatNumber(l.lump.massKg * 1000)} g`, formatNumber(l.lump.specificHeatJPerKgK), formatNumber(stage.cJPerK), formatNumber(stage.rKPerW), l.preset?.id ?? "(given c)"]),
    ),
    "Foster (modal) form:",
    formatTable(
      [{ heading: "mode" }, { heading: "R [K/W]", align: "right" }, { heading: "tau", align: "right" }],
      described.foster.map((s, i) => [String(i + 1), formatNumber(s.rKPerW), formatDuration(s.tauS)]),
    ),
    lineChart([{ label: "Zth of the lumped network", points: logSpacedTimes(from, to, 400).map((t) => ({ x: t, y: zth(model, t) })) }], {
      logX: true,
      yUnit: "K/W",
      width: Math.min(run.io.columns, 100),
    }),
    ...presets.map((p) => wrapText(`Material ${p.id}: c = ${p.specificHeatJPerKgK} J/(kg K) at 300 K, from ${p.source} (${p.provenance}).`, 100)),
    wrapText("Lumped model: each lump at one temperature (Biot number < 0.1); a long or poorly conducting element has hot spots this model does not show.", 100),
    "",
    emitted.text,
    formatCautions(false),
  ];
  run.io.out(out.join("\n"));
}

function required(raw: string | undefined, dimension: "mass" | "thermalResistance" | "specificHeat", flag: string, words: string): number {
  if (raw === undefined) throw inputError("bad-option", flag, words, "nothing");
  const value = parseQuantity(raw, dimension, flag);
  if (!(value > 0)) throw inputError("out-of-range", flag, `a value > 0 (${words})`, JSON.stringify(raw));
  return value;
}

function readLump(mass: string | undefined, material: string | undefined, specificHeat: string | undefined, prefix: "" | "body-"): { lump: LumpedMass; preset?: MaterialPreset } {
  const massKg = required(mass, "mass", `--${prefix}mass`, prefix === "" ? "the element's mass, such as \"3 g\"" : "the body's mass, such as \"20 g\"");
  if (material !== undefined && specificHeat !== undefined)
    throw inputError("bad-option", `--${prefix}specific-heat`, `either --${prefix}material or --${prefix}specific-heat, not both`, "both");
  if (material !== undefined) {
    const preset = materialPreset(material, `--${prefix}material`);
    return { lump: { massKg, specificHeatJPerKgK: preset.specificHeatJPerKgK }, preset };
  }
  if (specificHeat === undefined)
    throw inputError("bad-option", `--${prefix}material`, `a material preset (${MATERIALS.map((m) => m.id).join(", ")}) or --${prefix}specific-heat`, "nothing");
  return { lump: { massKg, specificHeatJPerKgK: required(specificHeat, "specificHeat", `--${prefix}specific-heat`, "a specific heat such as \"420 J/(kg K)\"") } };
}
