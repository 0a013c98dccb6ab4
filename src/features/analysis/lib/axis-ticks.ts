import { formatSI } from "@/lib/engine";

// Where the plots put their ticks, handed to uPlot's own axis options (incrs, splits, values).

/** Steps of 1, 2 and 5 times a power of ten, for linear axes (common practice on engineering plots). */
export const ONE_TWO_FIVE: number[] = Array.from({ length: 37 }, (_, k) => k - 18).flatMap((e) => [1, 2, 5].map((m) => Number(`${m}e${e}`)));

/** Steps for an axis in degrees: whole fractions of a turn first. */
export const DEGREE_STEPS: number[] = [1, 2, 5, 10, 15, 30, 45, 90, 180, 360];

/** A tick's text: engineering notation with an SI prefix and no unit (the axis label carries it): 1k, 10k, 4.7µ. */
export function engineeringTick(value: number): string {
  if (Math.abs(value) < 1e-300) return "0";
  return formatSI(value).replace(" ", "");
}

/**
 * Ticks of a log axis from min to max (both > 0) with room for at most `room` labels: the decades,
 * fewer when they would crowd; within less than two decades, 1-2-5 multiples.
 */
export function logTicks(min: number, max: number, room: number): number[] {
  if (!(min > 0) || !(max > min)) return [];
  const lo = Math.ceil(Math.log10(min) - 1e-9);
  const hi = Math.floor(Math.log10(max) + 1e-9);
  const space = Math.max(2, Math.floor(room));
  if (hi - lo + 1 >= 2) {
    // Every decade, every second, or whole SI prefixes apart (3, 6, 9… decades), anchored at 1.
    const needed = Math.ceil((hi - lo + 1) / space);
    const step = needed <= 2 ? needed : 3 * Math.ceil(needed / 3);
    const ticks: number[] = [];
    for (let e = lo; e <= hi; e++) if (e % step === 0 || step === 1) ticks.push(Number(`1e${e}`));
    return ticks.length >= 2 ? ticks : [Number(`1e${lo}`), Number(`1e${hi}`)];
  }
  // Less than two decades in view: 1, 2 and 5 times each power of ten, then every mantissa.
  for (const mantissas of [[1, 2, 5], [1, 2, 3, 4, 5, 6, 7, 8, 9]]) {
    const ticks: number[] = [];
    for (let e = lo - 1; e <= hi; e++) for (const m of mantissas) {
      const v = Number(`${m}e${e}`);
      if (v >= min * (1 - 1e-9) && v <= max * (1 + 1e-9)) ticks.push(v);
    }
    if (ticks.length >= 2) return ticks;
  }
  return [min, max];
}
