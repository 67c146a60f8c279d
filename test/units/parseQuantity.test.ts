import { describe, expect, test } from "vitest";
import { InputError, parseQuantity } from "../../src/internal.js";

describe("parseQuantity", () => {
  // SI prefixes and coherent units: SI brochure, 9th ed. (BIPM 2019), §3, Table 7 and §2.3 (section
  // and table numbers from memory).
  test.each([
    ["4.7 mF", "capacitance", 4.7e-3],
    ["350 ms", "time", 0.35],
    ["2.5 K/W", "thermalResistance", 2.5],
    ["40 degC", "temperature", 40],
    ["313.15 K", "temperature", 40],
    ["12 J/K", "heatCapacity", 12],
    ["10 kΩ", "resistance", 1e4],
    ["47 ohm", "resistance", 47],
    ["2.2 µF", "capacitance", 2.2e-6],
    ["900 J/(kg K)", "specificHeat", 900],
    ["-5 mV/K", "voltagePerKelvin", -5e-3],
    // a square-law K: A/V² (siemens per volt, S = A/V: SI brochure §2.3, from memory)
    ["12 A/V^2", "transconductanceParameter", 12],
    ["12 A/V²", "transconductanceParameter", 12],
    ["350 mA/V^2", "transconductanceParameter", 0.35],
    ["12 A V^-2", "transconductanceParameter", 12],
    ["12 A/V/V", "transconductanceParameter", 12],
    ["3 S/V", "transconductanceParameter", 3],
    ["95 %", "dimensionless", 0.95],
    ["1.5 kW", "power", 1500],
    ["3 min", "time", 180],
  ] as const)("parseQuantity(%j, %s) is %d in SI", (text, dimension, si) => {
    expect(parseQuantity(text, dimension, "f")).toBeCloseTo(si, 12);
  });

  test("parseQuantity passes a finite SI number through unchanged", () => {
    expect(parseQuantity(0.0047, "capacitance", "f")).toBe(0.0047);
  });

  test.each([
    ["4.7 mV", "capacitance", 'circuit.c: expected a capacitance such as "4.7 mF" (or a number in F), found "4.7 mV" (a voltage)'],
    ["12 A/V", "transconductanceParameter", 'circuit.c: expected a transconductance parameter (square law K) such as "12 A/V^2" (or a number in A/V^2), found "12 A/V" (another dimension)'],
    ["4.7 mFoo", "capacitance", 'circuit.c: expected a capacitance such as "4.7 mF" (or a number in F), found "4.7 mFoo" (unknown unit "mFoo")'],
    ["1e400 s", "time", 'circuit.c: expected a time such as "350 ms" (or a number in s), a finite number, found "1e400 s"'],
    ["2+3 s", "time", 'circuit.c: expected a time such as "350 ms" (or a number in s), found "2+3 s"'],
    ["", "time", 'circuit.c: expected a time such as "350 ms" (or a number in s), found ""'],
    [
      "10 degC",
      "temperatureDifference",
      'circuit.c: expected a temperature difference such as "10 K" (or a number in K); write differences in K, found "10 degC" (an absolute temperature)',
    ],
    [Number.POSITIVE_INFINITY, "time", 'circuit.c: expected a time such as "350 ms" (or a number in s), a finite number, found Infinity'],
    [true, "time", 'circuit.c: expected a time such as "350 ms" (or a number in s), found true'],
  ] as const)("parseQuantity(%j, %s) throws a clear message", (value, dimension, message) => {
    expect(() => parseQuantity(value, dimension, "circuit.c")).toThrow(InputError);
    expect(() => parseQuantity(value, dimension, "circuit.c")).toThrow(message);
  });

  test("parseQuantity never evaluates an expression", () => {
    expect(() => parseQuantity("import('fs')", "time", "x")).toThrow(InputError);
    expect(() => parseQuantity("1 s; 2", "time", "x")).toThrow(InputError);
  });
});
