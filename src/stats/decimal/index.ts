/**
 * Exact decimal shift of numeric columns (docs/language.md section 5): choose an exactly
 * representable offset from a column's decimal texts and subtract it on the digits.
 */
export { shiftDecimals, shiftReading, shiftReadingBorrowed, readDecimals, readDecimalsAgain, readDecimalsAgainInPlace, DecimalTextError, type DecimalReading } from './shift.ts';
export type { DecimalShift } from './shift.ts';
export { decimalOfDouble, exactDecimalText, roundQuotient, roundScaledInteger } from './exact.ts';
export type { DecimalOfDouble } from './exact.ts';
export { readDecimal, scanDecimal, scanDecimalIn, newDecimalScan } from './scan.ts';
export type { DecimalScan, ExactDecimal, TextRanges } from './scan.ts';
