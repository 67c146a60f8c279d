import { describe, expect, test } from "vitest";
import { InputError, allowedDrainCurrentA, checkSoa, soaDeratingFactor, validateSoaTable } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// An invented SOA table (demo data): a current limit, then power-limited lines on log-log axes.
// Log-log interpolation between corners and between durations is common practice (SOA charts are
// drawn on log-log axes, straight between corners): the expected values are that rule's algebra.
const soa = [
  { durationS: 1e-4, points: [{ vdsV: 10, idA: 100 }, { vdsV: 100, idA: 20 }] },
  { durationS: 1e-2, points: [{ vdsV: 10, idA: 40 }, { vdsV: 100, idA: 2 }] },
  { durationS: Number.POSITIVE_INFINITY, points: [{ vdsV: 10, idA: 10 }, { vdsV: 100, idA: 0.5 }] },
];

describe("allowedDrainCurrentA", () => {
  test.each([
    // [Vds, duration, allowed]: corners exact; log-log between corners: at sqrt(10·100) V on the
    // 100 µs line, sqrt(100·20) A; between durations at sqrt(1e-4·1e-2) s, the geometric mean of
    // the two lines' currents; below the first corner the first corner's current; DC for t > 10 ms.
    [10, 1e-4, 100],
    [100, 1e-2, 2],
    [Math.sqrt(1000), 1e-4, Math.sqrt(2000)],
    [10, 1e-3, Math.sqrt(100 * 40)],
    [5, 1e-4, 100],
    [10, 1e-6, 100],
    [10, 1, 10],
  ])("at %d V for %d s allows %d A", (v, t, i) => {
    // log/exp interpolation in double precision: 1e-13 relative
    expectClose(allowedDrainCurrentA(soa, v, t)!, i, { rel: 1e-13 });
  });

  test("above the last corner the table does not cover the point", () => {
    expect(allowedDrainCurrentA(soa, 150, 1e-4)).toBeUndefined();
  });

  test("a table without DC does not cover pulses longer than its longest line", () => {
    expect(allowedDrainCurrentA(soa.slice(0, 2), 50, 1)).toBeUndefined();
  });
});

describe("checkSoa", () => {
  const limit = allowedDrainCurrentA(soa, 40, 1e-3)!;
  test("flags a point just outside the boundary and passes one just inside", () => {
    // 0.1 % either side of the interpolated boundary: far above rounding (1e-13), close enough to
    // show the comparison is against the boundary itself.
    const inside = checkSoa(soa, [{ timeS: 0, vdsV: 40, idA: limit * 0.999 }], 1e-3);
    const outside = checkSoa(soa, [{ timeS: 0, vdsV: 40, idA: limit * 1.001 }], 1e-3);
    expect(inside.status).toBe("pass");
    expect(outside.status).toBe("fail");
    expect(outside.pointsOutside).toBe(1);
    expectClose(outside.worst!.utilisation, 1.001, { rel: 1e-12 });
  });

  test("checks every point and keeps the worst; points with no current are skipped", () => {
    const r = checkSoa(
      soa,
      [
        { timeS: 0, vdsV: 90, idA: 1 },
        { timeS: 1e-4, vdsV: 60, idA: 1.5 },
        { timeS: 2e-4, vdsV: 0.2, idA: 3 },
        { timeS: 3e-4, vdsV: 0, idA: 0 },
      ],
      1e-2,
    );
    expect(r.pointsChecked).toBe(3);
    // 10 ms line: I(V) = 40·(2/40)^(log10(V/10)); at 90 V it allows 2.30 A (use 43.5 %), at 60 V
    // 3.89 A (38.6 %), at 0.2 V 40 A (7.5 %): the first point is the worst.
    expect(r.worst!.timeS).toBe(0);
    expectClose(r.worst!.utilisation, 1 / (40 * 0.05 ** Math.log10(9)), { rel: 1e-13 });
    expect(r.status).toBe("pass");
  });

  test("a point above the table's voltage is reported as not covered", () => {
    expect(checkSoa(soa, [{ timeS: 0, vdsV: 120, idA: 0.1 }], 1e-3).status).toBe("outside-table");
  });
});

describe("validateSoaTable: bad tables get clear messages", () => {
  test.each([
    [[], "ratings.soa: expected at least one SOA boundary { duration, points }, found an empty table"],
    [[{ durationS: 1e-3, points: [{ vdsV: 10, idA: 5 }, { vdsV: 20, idA: 8 }] }], "ratings.soa[0].points[1].id: expected currents that do not rise with voltage (at most 5 A), found 8 A"],
    [[{ durationS: 1e-3, points: [{ vdsV: 20, idA: 5 }, { vdsV: 10, idA: 4 }] }], "ratings.soa[0].points[1].vds: expected voltages in increasing order (greater than 20 V), found 10 V"],
    [
      [
        { durationS: 1e-2, points: [{ vdsV: 10, idA: 5 }] },
        { durationS: 1e-3, points: [{ vdsV: 10, idA: 4 }] },
      ],
      "ratings.soa[1].duration: expected durations in increasing order (greater than 0.01 s), found 0.001",
    ],
    [
      [
        { durationS: 1e-3, points: [{ vdsV: 10, idA: 5 }, { vdsV: 100, idA: 1 }] },
        { durationS: 1e-2, points: [{ vdsV: 10, idA: 6 }] },
      ],
      "ratings.soa[1].points[0].id: expected at most the 5 A the shorter pulse allows at 10 V (a longer pulse cannot allow more), found 6 A",
    ],
  ])("%j", (table, message) => {
    expect(() => validateSoaTable(table)).toThrow(InputError);
    expect(() => validateSoaTable(table)).toThrow(message);
  });
});

describe("soaDeratingFactor (linear derating with temperature, common practice)", () => {
  const derating = { referenceC: 25, maxJunctionC: 175 };
  test.each([
    // (175 − T)/(175 − 25), capped to [0, 1]: exact binary fractions where possible
    [25, 1],
    [100, 0.5],
    [137.5, 0.25],
    [0, 1], // no credit below the reference
    [175, 0],
    [200, 0],
  ])("at %d °C the boundaries are scaled by %d", (t, k) => {
    expect(soaDeratingFactor(derating, t)).toBe(k);
  });

  test("a derated boundary fails a point the drawn one passes", () => {
    const point = [{ timeS: 0, vdsV: 10, idA: 60 }];
    expect(checkSoa(soa, point, 1e-4).status).toBe("pass"); // 60 of 100 A
    const hot = checkSoa(soa, point, 1e-4, "event", soaDeratingFactor(derating, 100)); // 60 of 50 A
    expect(hot.status).toBe("fail");
    expect(hot.worst!.allowedA).toBe(50);
    expect(hot.deratingFactor).toBe(0.5);
  });
});
