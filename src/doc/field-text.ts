/**
 * Values that arrive from binary files (a workbook's cells, a Parquet file's columns) as
 * the field text a table reads, so that what comes in reads back exactly: a number as the
 * shortest decimal text that names the same stored value, a date as ISO text.
 */

/** The shortest decimal text that reads back as the double `x` (JavaScript's own rule). */
export function shortestDoubleText(x: number): string {
  return String(x);
}

/** The shortest decimal text of a stored text number ("4.2000000000000002" gives "4.2"). */
export function shortestNumberText(text: string): string {
  const x = Number(text);
  return Number.isFinite(x) ? String(x) : text.trim();
}

/**
 * The shortest decimal text that reads back, rounded to single precision, as the 32-bit
 * float `x` (a float column stores 1.1 as 1.100000023841858; its text is "1.1").
 */
export function shortestFloat32Text(x: number): string {
  if (!Number.isFinite(x) || x === 0) return String(x);
  for (let p = 1; p <= 9; p++) {
    const s = String(Number(x.toPrecision(p)));
    if (Math.fround(Number(s)) === x) return s;
  }
  return String(x);
}

const pad = (n: number, width = 2): string => String(n).padStart(width, '0');

/** A date as ISO text: the day, and the time of day (UTC) when it is not midnight. */
export function isoDateText(d: Date): string {
  const day = `${pad(d.getUTCFullYear(), 4)}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`;
  const h = d.getUTCHours();
  const m = d.getUTCMinutes();
  const s = d.getUTCSeconds();
  const ms = d.getUTCMilliseconds();
  if (h === 0 && m === 0 && s === 0 && ms === 0) return day;
  return `${day}T${pad(h)}:${pad(m)}:${pad(s)}${ms !== 0 ? `.${pad(ms, 3)}` : ''}`;
}
