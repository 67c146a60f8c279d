import { createRequire } from "node:module";
import type { MathJsInstance } from "mathjs";

let instance: MathJsInstance | undefined;

/**
 * mathjs, loaded on first use. Importing mathjs costs about a second of start-up, so the library
 * loads it synchronously (through `createRequire`) only when a quantity string or an exact
 * BigNumber/Fraction computation actually needs it; `heatledger --help` never pays for it.
 * Cost: one module load per process.
 */
export function loadMathjs(): MathJsInstance {
  if (instance === undefined) {
    const require = createRequire(import.meta.url);
    const mathjs = require("mathjs") as { create: (f: unknown, c?: unknown) => MathJsInstance; all: unknown };
    instance = mathjs.create(mathjs.all, { number: "number" });
  }
  return instance;
}
