import { describe, expect, test } from "vitest";
import { fosterToModal, lockoutAfterBurst, uniformBurst } from "../../src/index.js";
import { expectClose } from "../helpers/expectClose.js";
import { rectangularFault } from "./scenarios.js";

// One RC stage (lumped capacitance, Incropera et al., 7th ed. (2011), §5.2, eq. 5.6). A burst of N
// pulses every T from ambient ends at θN = S·(1 − q^N)/(1 − q), S = P·R·(1 − e^(−t_on/τ)), q = e^(−T/τ).
// After a lockout L (from the end of the burst's last pulse) a second burst's k-th pulse ends at
//   θN·e^(−L/τ)·e^(−((k − 1)·T + t_on)/τ) + S·(1 − q^k)/(1 − q),
// so it is safe for L ≥ max over k of −τ·ln((ΔT − S_k)/(θN·e^(−((k − 1)·T + t_on)/τ))), and the part
// is back within δ of ambient after τ·ln(θN/δ).
describe("lockoutAfterBurst", () => {
  const R = 2;
  const tau = 10;
  const P = 50;
  const onS = 1;
  const T = 1.3;
  const N = 8;
  const dT = 60;
  const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: R, tauS: tau }] });
  const corner = rectangularFault("one stage", model, P, onS, { ambientC: 25, limitC: 90, marginK: 5 });

  test("one stage: lockout and return to ambient match the closed forms", () => {
    const S = P * R * -Math.expm1(-onS / tau);
    const q = Math.exp(-T / tau);
    const Sk = (k: number): number => (S * (1 - q ** k)) / (1 - q);
    const thetaN = Sk(N);
    let expected = 0;
    for (let k = 1; k <= N; k++) expected = Math.max(expected, -tau * Math.log((dT - Sk(k)) / (thetaN * Math.exp(-((k - 1) * T + onS) / tau))));
    const answer = lockoutAfterBurst([corner], uniformBurst(N, T, "start-to-start"), { ambientReturnK: 2 });
    expect(answer.burstSafe).toBe(true);
    // bisection to 1e-9 of the bracket; 1e-6 relative covers it with room
    expectClose(answer.minimumLockoutS!, expected, { rel: 1e-6 });
    expectClose(answer.ambientReturnS, tau * Math.log(thetaN / 2), { rel: 1e-6 });
    expect(answer.bands).toHaveLength(1);
    expect(answer.governing.corner).toBe("one stage");
    expectClose(answer.burstEndS, (N - 1) * T + onS, { rel: 1e-15 });
  });

  test("a cool burst needs no lockout", () => {
    const answer = lockoutAfterBurst([corner], uniformBurst(2, 5, "start-to-start"));
    expect(answer.minimumLockoutS).toBe(0);
  });
});
