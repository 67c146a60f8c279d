import { describe, expect, test } from "vitest";
import { VERDICTS, peakVerdict, ratingVerdict, verdictExitStatus, verdictLine, worstVerdict } from "../../src/internal.js";

// The one verdict rule of every judging command (a rule of our own, src/stress/Verdict.ts): a peak
// at or below limit − margin passes, inside the margin warns, above the limit fails; exit status 0
// for pass and warn, 1 for fail, and 1 for warn under --strict.
describe("the verdict rule", () => {
  // limit 150 °C, margin 20 K: the boundaries themselves belong to the milder word
  test.each([
    [100, "pass"],
    [130, "pass"],
    [130.001, "warn"],
    [148, "warn"],
    [150, "warn"],
    [150.001, "fail"],
    [Number.NaN, "fail"],
  ])("a peak of %d °C against 150 °C less 20 K: %s", (peakC, verdict) => {
    expect(peakVerdict(peakC, 150, 20)).toBe(verdict);
  });

  test("a zero margin has no warn: at the limit passes, above it fails", () => {
    expect(peakVerdict(150, 150, 0)).toBe("pass");
    expect(peakVerdict(150.001, 150, 0)).toBe("fail");
  });

  test.each([
    ["pass", false, 0],
    ["warn", false, 0],
    ["fail", false, 1],
    ["pass", true, 0],
    ["warn", true, 1],
    ["fail", true, 1],
  ] as const)("%s, strict %s: exit status %d", (verdict, strict, status) => {
    expect(verdictExitStatus(verdict, strict)).toBe(status);
  });

  test("the worst of several verdicts; none is a pass", () => {
    expect(worstVerdict([])).toBe("pass");
    expect(worstVerdict(["pass", "warn", "pass"])).toBe("warn");
    expect(worstVerdict(["warn", "fail", "pass"])).toBe("fail");
  });

  test("rating checks: over a rating fails, outside a table (not checked) warns", () => {
    expect([ratingVerdict("pass"), ratingVerdict("outside-table"), ratingVerdict("fail")]).toEqual(["pass", "warn", "fail"]);
  });

  test("the report line uses the word and its meaning, or the report's own reason", () => {
    expect(verdictLine("warn")).toBe(`Verdict: warn (${VERDICTS.warn.meaning}).`);
    expect(verdictLine("fail", "no feasible size")).toBe("Verdict: fail (no feasible size).");
  });
});
