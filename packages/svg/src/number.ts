/**
 * The one place where numbers become text. Every coordinate the renderer writes goes through
 * `formatNumber`, and svgo is run with the same precision, so output depends only on the input and
 * this setting.
 */

/** Decimal places kept in coordinates and sizes unless the caller asks otherwise. */
export const DEFAULT_PRECISION = 2

export function checkPrecision(precision: number): number {
  if (!Number.isInteger(precision) || precision < 0 || precision > 6) {
    throw new RangeError(`precision must be an integer from 0 to 6, got ${precision}`)
  }
  return precision
}

/** `value` at `precision` decimals (toFixed: the exact binary value, rounded), no trailing zeros, no `-0`. */
export function formatNumber(value: number, precision: number): string {
  if (!Number.isFinite(value)) throw new RangeError(`cannot write the number ${value}`)
  const text = value.toFixed(precision)
  const trimmed = text.includes('.') ? text.replace(/\.?0+$/, '') : text
  return trimmed === '-0' ? '0' : trimmed
}
