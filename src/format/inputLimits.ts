/**
 * The limits the CLI puts on what it reads, declared once (code, help and docs/limits.md read
 * them here). Each can be raised by an environment variable of its own, so a refusal always says
 * how to go further. They keep the memory and time of any run bounded whatever the input: a file
 * is measured before it is read, a document is measured before it is turned into data.
 */
export const INPUT_LIMITS = {
  /** largest input file read [MiB]: a field log of 8 MiB holds about 500,000 lines */
  maxInputMiB: { value: 8, env: "HEATLEDGER_MAX_INPUT_MB" },
  /** deepest nesting of mappings and lists in a YAML/JSON document, after aliases are expanded */
  maxNestingDepth: { value: 64, env: "HEATLEDGER_MAX_DEPTH" },
  /**
   * most values (mappings, lists, scalars) a YAML/JSON document may hold once its aliases are
   * expanded: about 60,000 listed events (use `repeat` for more). The YAML parser takes about
   * 1 KB and 30 µs per value, so this bounds a parse near 500 MB; the text is also refused before
   * parsing when it holds more than 1.5 separators (`,` `:` `[` `{` newline) per allowed value.
   */
  maxDocumentNodes: { value: 500_000, env: "HEATLEDGER_MAX_NODES" },
  /** most attempts a retry plan may ask about (`retryPlan.attempts`, the `attempts` of a retry event) */
  maxPlanAttempts: { value: 10_000, env: "HEATLEDGER_MAX_PLAN_ATTEMPTS" },
  /** most rows and columns of the lockout map (`retryPlan.map.attempts`, `retryPlan.map.points`): each cell is a burst simulated */
  maxMapSide: { value: 1_000, env: "HEATLEDGER_MAX_MAP_SIDE" },
} as const;

/** Name of one of the input limits. */
export type InputLimitName = keyof typeof INPUT_LIMITS;

/**
 * The value of a limit: its environment variable when that holds a positive number, else the
 * default. A variable that is set but not a positive number is ignored (the default holds).
 * @param name the limit
 * @param env the environment to read (the process's by default)
 */
export function inputLimit(name: InputLimitName, env: Readonly<Record<string, string | undefined>> = process.env): number {
  const limit = INPUT_LIMITS[name];
  const raw = env[limit.env];
  const value = raw === undefined ? Number.NaN : Number(raw);
  return Number.isFinite(value) && value > 0 ? value : limit.value;
}

/**
 * The words a refusal ends with: the limit's value and how to raise it.
 * Example: "64 levels (set HEATLEDGER_MAX_DEPTH to raise it)".
 */
export function limitWords(name: InputLimitName, unit = ""): string {
  return `${inputLimit(name)}${unit === "" ? "" : ` ${unit}`} (set ${INPUT_LIMITS[name].env} to raise it)`;
}
