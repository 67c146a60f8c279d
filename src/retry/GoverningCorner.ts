/**
 * The corner that decides an answer: the one with the least headroom (allowed temperature minus
 * peak) at the answer's value. Every planner answer carries one.
 */
export interface GoverningCorner {
  /** the corner's name */
  readonly corner: string;
  /** its highest temperature at the answer [°C] */
  readonly peakC: number;
  /** its limit − margin [°C] */
  readonly allowedC: number;
  /** its limit [°C] */
  readonly limitC: number;
  /** allowed − peak [K] (≥ 0 at a feasible answer) */
  readonly headroomK: number;
}

/**
 * The entry with the least headroom; ties go to the earlier corner.
 * Cost O(entries).
 */
export function governingCorner(entries: readonly GoverningCorner[]): GoverningCorner {
  let worst = entries[0]!;
  for (const e of entries) if (e.headroomK < worst.headroomK) worst = e;
  return worst;
}
