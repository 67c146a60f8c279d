// Invented test profiles for the supervision answers (not a test file: imported by the tests).
import { type DutyProfile, defaultCircuitModels, loadProfile } from "../../src/internal.js";

/** Settings of the one-stage series-resistor test profile. */
export interface OneStageSettings {
  readonly rThKPerW: number;
  readonly tauS: number;
  readonly resistanceOhm: number;
  readonly busV: readonly [number, number];
  readonly capacitanceF: readonly [number, number];
  readonly fraction: readonly [number, number];
  readonly ambientC: number;
  readonly limitC: number;
  readonly marginK: number;
  readonly timeoutS: number;
  readonly startVoltageV?: number;
  readonly checkTimesS?: readonly number[];
  readonly loads?: string;
  readonly retry?: string;
}

/** A series resistor on one Foster stage, with a supervision section, as profile text. */
export function oneStageProfileText(s: OneStageSettings): string {
  return `name: one-stage supervision test
ambient: ${s.ambientC} degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [ { r: ${s.rThKPerW} K/W, tau: ${s.tauS} s } ] }
    limits: { maxTemperature: ${s.limitC} degC, margin: ${s.marginK} K }
circuit:
  topology: series-resistor
  busVoltage: ${s.busV[1]} V
  capacitance: ${s.capacitanceF[1]} F
  resistance: ${s.resistanceOhm} ohm
  completion: { fraction: ${s.fraction[1]}, timeout: ${s.timeoutS} s }
  discharge: { kind: none }
supervision:
  corners:
    capacitance: [${s.capacitanceF[0]} F, ${s.capacitanceF[1]} F]
    busVoltage: [${s.busV[0]} V, ${s.busV[1]} V]
    completionFraction: [${s.fraction[0]}, ${s.fraction[1]}]
${s.loads ?? ""}  startVoltage: ${s.startVoltageV ?? 0} V
${s.checkTimesS === undefined ? "" : `  checkTimes: [${s.checkTimesS.map((t) => `${t} s`).join(", ")}]\n`}events:
  - power-up: {}
${s.retry ?? ""}`;
}

export function oneStageProfile(s: OneStageSettings): DutyProfile {
  return loadProfile(oneStageProfileText(s), "test.yaml");
}

export const MODELS = defaultCircuitModels;

/** The base one-stage settings both supervision test files start from (invented values). */
export const ONE_STAGE_BASE: OneStageSettings = {
  rThKPerW: 2,
  tauS: 10,
  resistanceOhm: 10,
  busV: [40, 50],
  capacitanceF: [1e-3, 2e-3],
  fraction: [0.9, 0.95],
  ambientC: 25,
  limitC: 150,
  marginK: 0,
  timeoutS: 1,
};
