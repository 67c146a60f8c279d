import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { type ThermalGraph, defaultCircuitModels, loadProfile, parseNetwork, parseStructuredText, simulateProfile } from "../../src/internal.js";
import { graphElements, runNgspice, spiceNumber } from "../thermal/ngspiceRunner.js";

// Outside reference: ngspice (Debian package `ngspice`), a general-purpose circuit simulator, on
// the same graph network as an RC netlist in the thermal analogy, in absolute temperatures: every
// node's heat capacity to ground (0 V = 0 °C, the fixed thermal reference), the links to ambient
// ending on a node driven by a PWL voltage source (the ambient trace, °C as volts) and the extra
// heat source a PWL current source (W as amperes) into the sink node. heatledger runs the same
// case as a profile (ambientProfile file, heatSources file) with no events but waits, sampled
// every 25 s, ngspice's waveform interpolated linearly at those times (step 0.5 s at most).
// Measured (2026-12, ngspice 39): worst difference 3.2e-4 K over temperatures of 20 to 73 °C, i.e.
// ngspice's integration error; the bound 5e-3 K is far below what a wrong ambient gain (a node
// that follows the ambient at once, or not at all: kelvins after the step) or source gain gives.

const NETWORK = "networks/mosfet-on-heatsink-graph.yaml";
const root = join(import.meta.dirname, "..", "..", "profiles");
const STOP_S = 1500;

/** Ambient: 20 °C, a 10 ms step to 35 °C at 300 s, a ramp down to 28 °C from 900 s to 1200 s. */
const AMBIENT: readonly (readonly [number, number])[] = [[0, 20], [300, 20], [300.01, 35], [900, 35], [1200, 28]];
/** Extra heat on the sink: off, a 1 s ramp to 40 W at 100 s, 40 W to 600 s, down to 15 W by 610 s. */
const HEAT: readonly (readonly [number, number])[] = [[0, 0], [100, 0], [101, 40], [600, 40], [610, 15]];

function pwl(points: readonly (readonly [number, number])[]): string {
  return `pwl(${points.map(([t, v]) => `${spiceNumber(t)} ${spiceNumber(v)}`).join(" ")})`;
}

describe("an ambient trace and a heat source on a graph node against ngspice", () => {
  test("die and sink temperatures over 1500 s agree within 0.005 K", () => {
    const files: Record<string, string> = {
      "amb.csv": `time [s], ambient [degC]\n${AMBIENT.map(([t, v]) => `${t}, ${v}`).join("\n")}\n`,
      "heat.csv": `time_s,power_w\n${HEAT.map(([t, v]) => `${t},${v}`).join("\n")}\n`,
    };
    const text = `name: n
ambientProfile: { file: amb.csv }
heatSources: [{ part: die, node: sink, file: heat.csv }]
parts:
  - { id: die, network: ${NETWORK}, source: die, observe: die, limits: { maxTemperature: 200 degC } }
  - { id: sink, network: ${NETWORK}, source: resistor, observe: sink, limits: { maxTemperature: 200 degC } }
events:
  - wait: ${STOP_S} s
`;
    const read = (path: string): string => files[path] ?? readFileSync(join(root, path), "utf8");
    const samples: { timeS: number; temperatureC: number[] }[] = [];
    simulateProfile(loadProfile(text, "n.yaml", read), {
      models: defaultCircuitModels,
      sampling: { everyS: 25 },
      onSample: (timeS, temperatureC) => samples.push({ timeS, temperatureC: temperatureC.slice() }),
    });
    expect(samples.length).toBeGreaterThan(50);

    const graph = parseNetwork(parseStructuredText(readFileSync(join(root, NETWORK), "utf8"), NETWORK).data, NETWORK) as ThermalGraph;
    const { lines, nodeName } = graphElements(graph);
    // graphElements ties "ambient" to ground; here the links to ambient end on the driven node "amb"
    const ambientLinks = new Set(graph.links.flatMap((l, i) => (l.from === "ambient" || l.to === "ambient" ? [`rg${i} `] : [])));
    const elements = [
      ...lines.map((l) => (ambientLinks.has(l.slice(0, l.indexOf(" ") + 1)) ? l.replace(/ 0 /, " amb ") : l)),
      `vamb amb 0 ${pwl(AMBIENT)}`,
      `iheat 0 ${nodeName("sink")} ${pwl(HEAT)}`,
    ];
    expect(elements.filter((l) => / amb /.test(l) && l.startsWith("rg")).length).toBe(1);
    let worst = 0;
    for (const [id, column] of [["die", 0], ["sink", 1]] as const) {
      const spice = runNgspice(elements, nodeName(id), STOP_S, 0.5);
      for (const s of samples) {
        const k = spice.timeS.findIndex((t) => t >= s.timeS);
        const t0 = spice.timeS[k - 1]!;
        const t1 = spice.timeS[k]!;
        const v = spice.riseK[k - 1]! + ((spice.riseK[k]! - spice.riseK[k - 1]!) * (s.timeS - t0)) / (t1 - t0);
        worst = Math.max(worst, Math.abs(v - s.temperatureC[column]!));
      }
    }
    expect(worst).toBeLessThan(0.005);
  });
});
