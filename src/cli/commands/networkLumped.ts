import type { Command } from "commander";
import {
  type LumpedMass,
  MATERIALS,
  type MaterialPreset,
  type ThermalNetwork,
  cauerToModal,
  describeNetwork,
  formatCautions,
  formatDuration,
  formatNumber,
  formatTable,
  GENERAL_CAUTION,
  inputError,
  lineChart,
  logSpacedTimes,
  lumpedNetwork,
  materialPreset,
  networkToDocument,
  parseQuantity,
  wrapText,
  zth,
} from "../../index.js";
import type { CliRun } from "../main.js";
import { type OutputFlags, addOutputFlags, emitNetwork } from "./networkBuildFlags.js";

/** The network forms `network lumped` can write. */
const LUMPED_FORMS = ["cauer", "foster"] as const;
/** Default form: the ladder's nodes are physical, so it can be chained with a heatsink. */
export const LUMPED_DEFAULT_FORM = "cauer";

interface LumpedFlags extends OutputFlags {
  mass?: string;
  material?: string;
  specificHeat?: string;
  rAmbient?: string;
  bodyMass?: string;
  bodyMaterial?: string;
  bodySpecificHeat?: string;
  rBody?: string;
  form: string;
}

/** `heatledger network lumped --mass ... --material ... --r-ambient ...`. */
export function registerNetworkLumped(network: Command, run: CliRun): void {
  const command = network
    .command("lumped")
    .description("build a one- or two-stage network from masses, materials and resistances")
    .option("--mass <kg>", "mass of the heated element (required), e.g. \"3 g\"")
    .option("--material <name>", `material preset of the element: ${MATERIALS.map((m) => m.id).join(", ")}`)
    .option("--specific-heat <J/(kg K)>", "specific heat of the element instead of a preset, e.g. \"420 J/(kg K)\"")
    .option("--r-ambient <K/W>", "resistance from the last lump (element, or body) to ambient (required), e.g. \"12 K/W\"")
    .option("--body-mass <kg>", "mass of the body the element sits on (gives a second stage)")
    .option("--body-material <name>", "material preset of the body")
    .option("--body-specific-heat <J/(kg K)>", "specific heat of the body instead of a preset")
    .option("--r-body <K/W>", "resistance from the element to the body (with --body-mass)")
    .option("--form <form>", `network form to write: ${LUMPED_FORMS.join(" or ")}`, LUMPED_DEFAULT_FORM);
  addOutputFlags(command);
  command.addHelpText(
    "after",
    `
One stage: the element's heat capacity C = m*c, its resistance to ambient R; tau = R*C.
Two stages: the element (C1, then R1 to the body) and the body (C2, then R2 to ambient), a Cauer
ladder whose nodes are physical: heat enters the element, the body buffers it.
Each lump is taken as one uniform temperature, which holds when it is small or conducts well
(Biot number h*L/k < 0.1): a resistance wire, a thin film, a small ceramic core; not a long rod
heated at one end. Specific heats are at 300 K; metals store about 5-15 % more when hot.

Material presets (300 K; values recalled from the named handbook tables, verify the last digit):
${MATERIALS.map((m) => `  ${m.id.padEnd(16)} c = ${String(m.specificHeatJPerKgK).padStart(4)} J/(kg K)  ${m.name}`).join("\n")}

Examples:
  heatledger network lumped --mass "3 g" --material nichrome --r-ambient "40 K/W"
  heatledger network lumped --mass "0.5 g" --material nichrome --r-body "2 K/W" \\
      --body-mass "20 g" --body-material alumina --r-ambient "25 K/W" --out resistor.yaml`,
  );
  command.action((options: LumpedFlags) => {
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
    const written: ThermalNetwork = form === "foster" ? { kind: "foster", stages: described.foster } : ladder;
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
        caution: GENERAL_CAUTION,
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
  });
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
