import { createRequire } from "node:module";
import type { MathJsInstance } from "mathjs";

let instance: MathJsInstance | undefined;

/** The part of mathjs' module this project uses: its factory-based `create` and two dependency sets. */
interface MathjsModule {
  create: (factories: unknown, config?: unknown) => MathJsInstance;
  unitDependencies: unknown;
  fractionDependencies: unknown;
}

/**
 * mathjs, loaded on first use, as a small instance holding only what the project needs: units
 * (parseQuantity) and exact fractions (fosterToCauer). It is built from mathjs' single-file
 * bundle (`mathjs/lib/browser/math.js`, an entry its package exports): the main entry loads
 * several hundred modules and builds every function, about a second of start-up, where the
 * bundle and the small instance take a few hundred milliseconds. `heatledger --help` never pays
 * for either: nothing loads until a quantity string or an exact conversion needs it.
 * Cost: one module load per process.
 */
export function loadMathjs(): MathJsInstance {
  if (instance === undefined) {
    const require = createRequire(import.meta.url);
    const mathjs = require("mathjs/lib/browser/math.js") as MathjsModule;
    instance = mathjs.create({ unitDependencies: mathjs.unitDependencies, fractionDependencies: mathjs.fractionDependencies }, { number: "number" });
  }
  return instance;
}
