import { FieldReader, join } from "../format/FieldReader.js";
import type { BusLoad } from "../circuits/BusLoad.js";
import type { DischargePath } from "../circuits/dischargeVoltage.js";
import type { ProfileCircuit } from "./DutyProfile.js";
import { type CircuitInput, type LoadInput } from "./profileSchema.js";
import { PROFILE_DEFAULTS } from "./profileDefaults.js";
import { resolveContactor, resolveProtection } from "./resolveProtection.js";
import { resolveResistanceCurve } from "./resolveResistanceCurve.js";
import type { ResistanceCurve } from "../circuits/ResistanceCurve.js";
import type { CircuitRole } from "./DutyProfile.js";

/*
 * A profile's `circuit` section resolved into SI values: topology, element values, completion,
 * bus load and discharge path.
 * Part of loading a profile (loadProfile.ts orchestrates).
 */

/** Topology → roles its model reports a power trace for. */
export const TOPOLOGY_ROLES: Record<CircuitInput["topology"], readonly CircuitRole[]> = {
  "series-resistor": ["resistor"],
  "linear-mosfet": ["mosfet", "sourceResistor"],
  converter: ["switch"],
};
/**
 * The `circuit` section in SI values, every problem recorded on the reader (undefined when
 * any was found). Source: profile keys of our own (docs/profile-format.md).
 */
export function resolveCircuit(reader: FieldReader, c: CircuitInput, field: string): ProfileCircuit | undefined {
  const forbid = (keys: readonly (keyof CircuitInput)[]): void => {
    for (const key of keys) if (c[key] !== undefined) reader.fail("bad-profile", join(field, key), `no "${key}" in a ${c.topology} circuit`, "a value");
  };
  const completion = c.completion;
  if (completion.fraction === undefined && completion.within === undefined && completion.dwell === undefined)
    reader.fail("bad-profile", join(field, "completion"), "at least one of fraction, within or dwell (when the charge counts as done)", "only a timeout");
  const load = resolveLoad(reader, c.load ?? { kind: "none" }, join(field, "load"), c.busVoltage);
  const discharge = resolveDischarge(reader, c.discharge, join(field, "discharge"));
  const protection = c.protection === undefined ? undefined : resolveProtection(reader, c.protection, join(field, "protection"));
  const common = {
    busVoltageV: c.busVoltage,
    capacitanceF: c.capacitance,
    load: load ?? { kind: "none" as const },
    completion: {
      timeoutS: completion.timeout,
      ...(completion.fraction === undefined ? {} : { fraction: completion.fraction }),
      ...(completion.within === undefined ? {} : { withinV: completion.within }),
      ...(completion.dwell === undefined ? {} : { dwellS: completion.dwell }),
      ...(protection === undefined ? {} : { protection }),
    },
    discharge: discharge ?? { kind: "none" as const },
    ...(c.contactor === undefined ? {} : { contactor: resolveContactor(c.contactor) }),
    ...(c.peakCurrentRating === undefined ? {} : { peakCurrentRatingA: c.peakCurrentRating }),
  };
  switch (c.topology) {
    case "series-resistor":
      forbid(["mosfet", "converter"]);
      if (c.resistance === undefined) {
        reader.fail("bad-profile", join(field, "resistance"), 'the pre-charge resistance, such as "10 ohm" (required for series-resistor)', "nothing");
        return undefined;
      }
      return { ...common, topology: "series-resistor", resistanceOhm: c.resistance, ...(c.sourceResistance === undefined ? {} : { sourceResistanceOhm: c.sourceResistance }), ...curveOf(reader, c, field) };
    case "linear-mosfet": {
      forbid(["resistance", "converter", "sourceResistance", "resistorTemperature"]);
      const m = c.mosfet;
      if (m === undefined) {
        reader.fail("bad-profile", join(field, "mosfet"), "a mosfet section (gateVoltage, thresholdVoltage, sourceResistor or saturationCurrent, rdsOn)", "nothing");
        return undefined;
      }
      if (m.sourceResistor === undefined && m.saturationCurrent === undefined && m.transconductance === undefined)
        reader.fail("bad-profile", join(field, "mosfet"), "a sourceResistor, a saturationCurrent or a transconductance (what limits the current)", "none of them");
      if (m.transconductanceExponent !== undefined && m.transconductanceExponent !== 0 && m.transconductance === undefined)
        reader.fail("bad-profile", join(field, "mosfet.transconductanceExponent"), "a transconductance beside it (the K whose drift it gives)", "no transconductance");
      if (m.gateVoltage <= m.thresholdVoltage)
        reader.fail("out-of-range", join(field, "mosfet.gateVoltage"), `a gate voltage above the threshold (${m.thresholdVoltage} V)`, `${m.gateVoltage} V`);
      return {
        ...common,
        topology: "linear-mosfet",
        gateVoltageV: m.gateVoltage,
        thresholdVoltageV: m.thresholdVoltage,
        rdsOnOhm: m.rdsOn,
        ...(m.sourceResistor === undefined ? {} : { sourceResistorOhm: m.sourceResistor }),
        ...(m.saturationCurrent === undefined ? {} : { saturationCurrentA: m.saturationCurrent }),
        ...(m.thresholdTempco === undefined ? {} : { thresholdTempcoVPerK: m.thresholdTempco }),
        ...(m.transconductance === undefined ? {} : { transconductanceAPerV2: m.transconductance }),
        ...(m.transconductanceExponent === undefined ? {} : { transconductanceExponent: m.transconductanceExponent }),
        ...(m.loopGainWarning === undefined ? {} : { loopGainWarning: m.loopGainWarning }),
      };
    }
    case "converter": {
      forbid(["resistance", "mosfet", "sourceResistance", "resistorTemperature"]);
      const v = c.converter;
      if (v === undefined) {
        reader.fail("bad-profile", join(field, "converter"), "a converter section (mode, current or power, efficiency)", "nothing");
        return undefined;
      }
      if (v.mode === "constant-current" && v.current === undefined) reader.fail("bad-profile", join(field, "converter.current"), 'a charging current such as "2 A" (required for constant-current)', "nothing");
      if (v.mode === "constant-power" && v.power === undefined) reader.fail("bad-profile", join(field, "converter.power"), 'a charging power such as "200 W" (required for constant-power)', "nothing");
      return {
        ...common,
        topology: "converter",
        mode: v.mode,
        efficiency: v.efficiency,
        ...(v.current === undefined ? {} : { currentA: v.current }),
        ...(v.power === undefined ? {} : { powerW: v.power }),
        ...(v.currentLimit === undefined ? {} : { currentLimitA: v.currentLimit }),
      };
    }
  }
}

/**
 * One bus load (`circuit.load` or a fault's load) in SI values; the bus voltage bounds the
 * voltages it may name. Problems are recorded on the reader (undefined when any was found).
 */
export function resolveLoad(reader: FieldReader, l: LoadInput, field: string, busVoltageV: number): BusLoad | undefined {
  const need = { none: [], short: [], resistive: ["resistance"], "constant-current": ["current"], "constant-power": ["power", "enableAt"] } as const;
  const allowed: Record<LoadInput["kind"], readonly string[]> = {
    none: [],
    short: [],
    resistive: ["resistance"],
    "constant-current": ["current", "enableAt", "disableAt"],
    "constant-power": ["power", "enableAt", "disableAt"],
  };
  let ok = true;
  for (const key of ["resistance", "current", "power", "enableAt", "disableAt"] as const) {
    if (l[key] !== undefined && !allowed[l.kind].includes(key)) {
      reader.fail("bad-profile", join(field, key), `no "${key}" for a ${l.kind} load`, "a value");
      ok = false;
    }
  }
  for (const key of need[l.kind]) {
    if (l[key] === undefined) {
      reader.fail("bad-profile", join(field, key), `this value (required for a ${l.kind} load)`, "nothing");
      ok = false;
    }
  }
  if (l.enableAt !== undefined && l.enableAt >= busVoltageV) {
    reader.fail("out-of-range", join(field, "enableAt"), `a voltage below the bus voltage (${busVoltageV} V)`, `${l.enableAt} V`);
    ok = false;
  }
  if (l.enableAt !== undefined && l.disableAt !== undefined && l.disableAt > l.enableAt) {
    reader.fail("out-of-range", join(field, "disableAt"), `a voltage at or below enableAt (${l.enableAt} V)`, `${l.disableAt} V`);
    ok = false;
  } else if (l.enableAt !== undefined && l.disableAt !== undefined && l.disableAt === l.enableAt && !(l.kind === "constant-current" && l.enableAt === 0)) {
    // the circuit models need a band between the two levels (validateBusLoad): refused here, where the line is known
    reader.fail("out-of-range", join(field, "disableAt"), `a voltage below enableAt (${l.enableAt} V): the load needs a band between switching on and off`, `${l.disableAt} V`);
    ok = false;
  }
  if (l.kind === "constant-power" && l.disableAt !== undefined && !(l.disableAt > 0)) {
    reader.fail("out-of-range", join(field, "disableAt"), "a disable (under-voltage lockout) voltage > 0 V: a constant-power load draws P/V, which grows without bound as the bus falls to 0 V", `${l.disableAt} V`);
    ok = false;
  }
  if (!ok) return undefined;
  switch (l.kind) {
    case "none":
    case "short":
      return { kind: l.kind };
    case "resistive":
      return { kind: "resistive", resistanceOhm: l.resistance! };
    case "constant-current":
      return { kind: "constant-current", currentA: l.current!, ...(l.enableAt === undefined ? {} : { enableV: l.enableAt }), ...(l.disableAt === undefined ? {} : { disableV: l.disableAt }) };
    case "constant-power":
      return { kind: "constant-power", powerW: l.power!, enableV: l.enableAt!, disableV: l.disableAt ?? l.enableAt! * PROFILE_DEFAULTS.converterDisableRatio };
  }
}

function resolveDischarge(reader: FieldReader, d: CircuitInput["discharge"], field: string): DischargePath | undefined {
  const allowed: Record<typeof d.kind, readonly string[]> = { none: [], bleeder: ["resistance"], "constant-current": ["current", "bleeder"], active: ["resistance", "until", "bleeder"] };
  const required: Record<typeof d.kind, readonly ("resistance" | "current")[]> = { none: [], bleeder: ["resistance"], "constant-current": ["current"], active: ["resistance"] };
  let ok = true;
  for (const key of ["resistance", "current", "until", "bleeder"] as const) {
    if (d[key] !== undefined && !allowed[d.kind].includes(key)) {
      reader.fail("bad-profile", join(field, key), `no "${key}" for a ${d.kind} discharge`, "a value");
      ok = false;
    }
  }
  for (const key of required[d.kind]) {
    if (d[key] === undefined) {
      reader.fail("bad-profile", join(field, key), `this value (required for a ${d.kind} discharge)`, "nothing");
      ok = false;
    }
  }
  if (!ok) return undefined;
  switch (d.kind) {
    case "none":
      return { kind: "none" };
    case "bleeder":
      return { kind: "bleeder", resistanceOhm: d.resistance! };
    case "constant-current":
      return { kind: "constant-current", currentA: d.current!, ...(d.bleeder === undefined ? {} : { bleederOhm: d.bleeder }) };
    case "active":
      return { kind: "active", resistanceOhm: d.resistance!, ...(d.until === undefined ? {} : { untilV: d.until }), ...(d.bleeder === undefined ? {} : { bleederOhm: d.bleeder }) };
  }
}

/** The series resistor's temperature curve, when the profile gives one. */
function curveOf(reader: FieldReader, c: CircuitInput, field: string): { temperatureCurve?: ResistanceCurve } {
  const curve = resolveResistanceCurve(reader, c, join(field, "resistorTemperature"));
  return curve === undefined ? {} : { temperatureCurve: curve };
}
