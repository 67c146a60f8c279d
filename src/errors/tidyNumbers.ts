/** A decimal with twelve or more digits after the point, optionally with an exponent. */
const LONG_DECIMAL = /(?<![\w.])(\d+\.\d{12,})(e[-+]?\d+)?(?![\w.])/gi;

/**
 * Numbers in a message with the noise of binary floating point removed: a decimal written with
 * twelve or more digits after the point is rounded to 12 significant digits and written in its
 * shortest form, so a sum such as 0.5 + 0.2 shows as "0.7 s", not "0.7000000000000001 s". Twelve
 * digits keep every value a user types (a double carries 15 to 17) while dropping the last-bit
 * error of one or a few operations.
 * Source: IEEE 754-2019 §5.12.2 (shortest decimal that round-trips a binary64 value).
 */
export function tidyNumbers(text: string): string {
  return text.replace(LONG_DECIMAL, (match) => {
    const value = Number(match);
    return Number.isFinite(value) ? String(Number(value.toPrecision(12))) : match;
  });
}
