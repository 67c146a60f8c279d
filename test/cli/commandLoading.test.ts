import { describe, expect, test } from "vitest";
import { cliModuleLoads } from "../helpers/cliModuleLoads.js";

// Start-up cost: each command's flags and help are defined eagerly, its implementation (and the
// library modules it needs) is imported only when it runs (DEVELOPERS.md, "How to add a command").
// A fresh process runs the built CLI and lists every module it loaded; a static import of the
// library index, or of an action module, from a command definition makes these tests fail.

/** The fitting libraries: only `network fit` and `network from-rating` need them. */
const FITTING_PACKAGES = ["ml-fcnnls", "ml-levenberg-marquardt", "ml-matrix"];

describe("runCli loads each command's implementation only when it runs", () => {
  test.each([[["--help"]], [["--version"]], [["simulate", "--help"]], [["replay", "--help"]], [["network", "--help"]], [["network", "fit", "--help"]], [["size", "--help"]], [["guard", "--help"]], [["fleet", "--help"]]])(
    "%j loads commander and the definitions, no library package and no action module",
    (args) => {
      const loads = cliModuleLoads(args);
      expect(loads.status).toBe(0);
      expect(loads.packages).toEqual(["commander"]);
      expect(loads.dist).not.toContain("dist/index.js");
      expect(loads.dist.filter((file) => file.endsWith("Action.js"))).toEqual([]);
    },
  );

  test("simulate PROFILE loads what simulate needs, not the fitting libraries, the planners or the library index", () => {
    const loads = cliModuleLoads(["simulate", "profiles/warehouse-robot-48v.yaml"]);
    expect(loads.status).toBe(0);
    // it did load its own implementation and the profile's parsers (so the listing sees lazy imports)
    expect(loads.dist).toContain("dist/cli/commands/simulateAction.js");
    expect(loads.packages).toEqual(expect.arrayContaining(["yaml", "zod"]));
    expect(loads.packages.filter((name) => FITTING_PACKAGES.includes(name))).toEqual([]);
    // the profile's quantities ("51.2 V", "3.3 mF", "8 h") are read without mathjs, and no CSV
    // is read or written, so neither mathjs nor the CSV packages load
    expect(loads.packages.filter((name) => ["mathjs", "csv-parse", "csv-stringify"].includes(name))).toEqual([]);
    expect(loads.dist).not.toContain("dist/index.js");
    expect(loads.dist).not.toContain("dist/thermal/fitFosterNetwork.js");
    // of the planners (src/retry, src/size, src/supervise) only the default tables the help texts print
    expect(loads.dist.filter((file) => /^dist\/(retry|size|supervise)\//.test(file))).toEqual(["dist/retry/planDefaults.js", "dist/size/sizeDefaults.js", "dist/supervise/superviseDefaults.js"]);
    expect(loads.dist.filter((file) => file.endsWith("Action.js"))).toEqual(["dist/cli/commands/simulateAction.js"]);
  });

  test("replay LOG loads what simulate needs, not csv-parse (the log is scanned as it streams), the fitting libraries, the planners or the library index", () => {
    const loads = cliModuleLoads(["replay", "profiles/logs/irrigation-pump-returned-unit.csv", "--profile", "profiles/irrigation-pump-decade.yaml"]);
    expect(loads.status).toBe(1); // the bundled log crosses the limit
    expect(loads.dist).toContain("dist/cli/commands/replayAction.js");
    expect(loads.packages).toEqual(expect.arrayContaining(["yaml", "zod"]));
    expect(loads.packages).not.toContain("csv-parse");
    expect(loads.packages.filter((name) => FITTING_PACKAGES.includes(name))).toEqual([]);
    expect(loads.dist).not.toContain("dist/index.js");
    expect(loads.dist.filter((file) => /^dist\/(retry|size|supervise)\//.test(file))).toEqual(["dist/retry/planDefaults.js", "dist/size/sizeDefaults.js", "dist/supervise/superviseDefaults.js"]);
    expect(loads.dist.filter((file) => file.endsWith("Action.js"))).toEqual(["dist/cli/commands/replayAction.js"]);
  });

  test("network show FILE loads neither the fitting libraries nor the profile schema", () => {
    const loads = cliModuleLoads(["network", "show", "profiles/networks/wirewound-resistor-foster.yaml"]);
    expect(loads.status).toBe(0);
    expect(loads.packages.filter((name) => [...FITTING_PACKAGES, "zod"].includes(name))).toEqual([]);
    expect(loads.dist).not.toContain("dist/index.js");
  });

  test("network fit POINTS loads the fitting libraries when it runs", () => {
    const loads = cliModuleLoads(["network", "fit", "profiles/networks/example-zth.csv"]);
    expect(loads.status).toBe(0);
    expect(loads.packages).toEqual(expect.arrayContaining(["ml-fcnnls", "ml-levenberg-marquardt"]));
    expect(loads.dist).toContain("dist/cli/commands/networkFitAction.js");
    expect(loads.dist).not.toContain("dist/index.js");
  });

  test("the chart packages (vega, vega-lite) load only for --report or --svg", () => {
    const CHART_PACKAGES = ["vega", "vega-lite"];
    for (const args of [["simulate", "profiles/warehouse-robot-48v.yaml"], ["retries", "profiles/warehouse-robot-48v.yaml", "--json"]]) {
      const loads = cliModuleLoads(args);
      expect(loads.status).toBe(0);
      expect(loads.packages.filter((name) => CHART_PACKAGES.includes(name))).toEqual([]);
      expect(loads.dist.filter((file) => /renderChartSvg|writeChartReport|simulationCharts/.test(file))).toEqual([]);
    }
    // the helper's io refuses every write: the run renders the chart, then stops at the write
    // (a write error is the user's to mend: status 2)
    const loads = cliModuleLoads(["simulate", "profiles/warehouse-robot-48v.yaml", "--svg", "never-written.svg"]);
    expect(loads.status).toBe(2);
    expect(loads.packages).toEqual(expect.arrayContaining(CHART_PACKAGES));
    expect(loads.dist).toContain("dist/report/renderChartSvg.js");
  });
});
