import { type FieldReader, join } from "../format/FieldReader.js";
import type { AttemptProtection } from "../circuits/AttemptProtection.js";
import type { ContactorSpec } from "../circuits/contactorClosing.js";
import type { ContactorInput, ProtectionInput } from "./profileSchema.js";

/*
 * A circuit's `protection` and `contactor` keys resolved into SI values (keys of our own,
 * docs/profile-format.md). Part of loading a profile (resolveProfileCircuit.ts calls these).
 */

/**
 * `circuit.protection` as the circuit layer's AttemptProtection; problems (a check with neither
 * `below` nor `above`, a rise check that ends before it starts) recorded on the reader
 * (undefined when any was found). Cost O(checks).
 */
export function resolveProtection(reader: FieldReader, p: ProtectionInput, field: string): AttemptProtection | undefined {
  let ok = true;
  (p.busChecks ?? []).forEach((b, i) => {
    if (b.below === undefined && b.above === undefined) {
      reader.fail("bad-profile", join(field, `busChecks[${i}]`), 'a "below" voltage (bus too slow) or an "above" voltage (bus too fast)', "neither");
      ok = false;
    }
  });
  (p.riseChecks ?? []).forEach((r, i) => {
    if (!(r.to > r.from)) {
      reader.fail("out-of-range", join(field, `riseChecks[${i}].to`), `an end time after "from" (${r.from} s)`, `${r.to} s`);
      ok = false;
    }
  });
  if (!ok) return undefined;
  const i2t = [
    ...(p.fuse === undefined ? [] : [{ limitA2s: p.fuse.i2t, kind: "fuse" as const }]),
    ...(p.firmwareI2t === undefined ? [] : [{ limitA2s: p.firmwareI2t, kind: "firmware" as const }]),
  ];
  return {
    ...(p.busChecks === undefined ? {} : { busChecks: p.busChecks.map((b) => ({ atS: b.at, ...(b.below === undefined ? {} : { minV: b.below }), ...(b.above === undefined ? {} : { maxV: b.above }) })) }),
    ...(p.riseChecks === undefined ? {} : { riseChecks: p.riseChecks.map((r) => ({ fromS: r.from, toS: r.to, minRateVPerS: r.atLeast })) }),
    ...(p.overCurrent === undefined ? {} : { overCurrent: { currentA: p.overCurrent.above, delayS: p.overCurrent.for } }),
    ...(i2t.length === 0 ? {} : { i2t }),
    ...(p.maxOnTime === undefined ? {} : { maxOnTimeS: p.maxOnTime }),
  };
}

/** `circuit.contactor` in SI. Cost O(1). */
export function resolveContactor(c: ContactorInput): ContactorSpec {
  return { makingCurrentA: c.makingCurrent, loopResistanceOhm: c.loopResistance, ...(c.loopInductance === undefined ? {} : { loopInductanceH: c.loopInductance }) };
}
