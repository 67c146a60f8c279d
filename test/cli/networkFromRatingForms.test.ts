import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { expectClose } from "../helpers/expectClose.js";
import { memoryIo } from "../helpers/memoryIo.js";

// `network from-rating` reads a pulse rating in the forms resistor ratings are published in:
// single-pulse energy (the default), peak pulse power against duration, and any series of a
// resistor family file (energy per ohm against the value included).

const root = fileURLToPath(new URL("../..", import.meta.url));
const FAMILIES = readFileSync(`${root}profiles/parts/resistor-families.yaml`, "utf8");

async function run(args: string[], files: Record<string, string>) {
  const io = memoryIo(files);
  const status = await runCli(args, io);
  return { status, out: io.stdout.join(""), err: io.stderr.join("") };
}

interface RatingJson {
  form: string;
  startTemperatureC: number;
  maxTemperatureC: number;
  energyTable: { durationS: number; energyJ: number }[];
  zthPoints: { timeS: number; zthKPerW: number }[];
}

describe("network from-rating in the other forms", () => {
  test("--form power: each row becomes E = P·t (Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §2.2)", async () => {
    const csv = "duration [ms], power [W]\n1, 250\n10, 50\n100, 10\n1000, 3\n";
    const r = await run(["network", "from-rating", "p.csv", "--form", "power", "--start-temperature", "70 degC", "--max-temperature", "155 degC", "--json"], { "p.csv": csv });
    expect(r.status).toBe(0);
    const json = JSON.parse(r.out) as RatingJson;
    // 250 W · 1 ms = 0.25 J, 50 W · 10 ms = 0.5 J, 10 W · 0.1 s = 1 J, 3 W · 1 s = 3 J
    [0.25, 0.5, 1, 3].forEach((e, i) => expectClose(json.energyTable[i]!.energyJ, e, { rel: 1e-12 }));
    // Zth(t_p) = ΔT·t_p/E = 85 K · 1 ms / 0.25 J = 0.34 K/W: the power form gives ΔT/P directly
    expectClose(json.zthPoints[0]!.zthKPerW, 85 / 250, { rel: 1e-12 });
    expect(json.form).toMatch(/peak pulse power/);
  });

  test("a family series rated in energy per ohm, read at the part's value, with the series' temperatures", async () => {
    const r = await run(["network", "from-rating", "f.yaml", "--series", "ww-housed-100w", "--resistance", "68 ohm", "--json"], { "f.yaml": FAMILIES });
    expect(r.status).toBe(0);
    const json = JSON.parse(r.out) as RatingJson;
    expect([json.startTemperatureC, json.maxTemperatureC]).toEqual([25, 300]);
    // 10 ms column, 68 ohm between the 10 ohm (110 J/ohm) and 100 ohm (7.2 J/ohm) rows:
    // f = log10(6.8) = 0.83251; E/R = 110·(7.2/110)^0.83251 = 110·e^(0.83251·(−2.72640)) = 110·0.103338
    // = 11.3672 J/ohm; E = 68 · 11.3672 = 772.97 J (log-log interpolation: common practice)
    expectClose(json.energyTable[0]!.energyJ, 772.97, { rel: 1e-5 });
    expect(json.form).toMatch(/energy per ohm of series ww-housed-100w, read log-log at 68 ohm/);
  });

  test("the surface-mount series of the bundled family file (peak pulse power)", async () => {
    const r = await run(["network", "from-rating", "f.yaml", "--series", "smd-thick-film-2512"], { "f.yaml": FAMILIES });
    expect(r.status).toBe(0);
    expect(r.out).toContain("Form: peak pulse power of series smd-thick-film-2512, E = P·t per row");
    expect(r.out.split("\n").every((l) => l.length <= 100)).toBe(true);
  });

  test.each([
    [["--series", "nope"], /--series: expected the id of a series in f\.yaml: "ww-housed-100w", "smd-thick-film-2512", found "nope"/],
    [["--series", "ww-housed-100w"], /--resistance: expected the part's resistance value/],
    [["--series", "ww-housed-100w", "--resistance", "5 kohm"], /--resistance: expected a resistance the series covers, 1 to 1000 ohm/],
    [["--series", "ww-housed-100w", "--form", "power"], /--form: expected no --form with a family file/],
  ])("bad flags with a family file exit 2 naming the flag: %j", async (flags, message) => {
    const r = await run(["network", "from-rating", "f.yaml", ...flags], { "f.yaml": FAMILIES });
    expect(r.err).toMatch(message);
    expect(r.status).toBe(2);
  });
});
