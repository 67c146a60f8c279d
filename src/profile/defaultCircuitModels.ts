import { inputError } from "../errors/InputError.js";
import type { CircuitModels } from "./CircuitModels.js";

/**
 * The circuit models the CLI uses. The pre-charge and discharge models of src/circuits are wired
 * in here as they land; until then a profile with charging events is refused with a clear
 * message (power-trace profiles need no circuit model).
 */
export const defaultCircuitModels: CircuitModels = {
  charge: (circuit) => {
    throw inputError("bad-profile", "circuit.topology", "a topology whose circuit model is part of this build", JSON.stringify(circuit.topology));
  },
  discharge: (path, _c, v) => {
    if (path.kind === "none") return v;
    throw inputError("bad-profile", "circuit.discharge.kind", "a discharge path whose model is part of this build", JSON.stringify(path.kind));
  },
};
