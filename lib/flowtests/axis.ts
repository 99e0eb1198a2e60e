/** Round axis divisions for the charts on screen and on paper. */

/** A round step (1, 2, 2.5 or 5 × 10ⁿ) for about `count` divisions of `range`. */
export function niceStep(range: number, count = 5): number {
  if (!(range > 0)) return 1;
  const raw = range / count;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const norm = raw / magnitude;
  const nice = norm <= 1 ? 1 : norm <= 2 ? 2 : norm <= 2.5 ? 2.5 : norm <= 5 ? 5 : 10;
  return nice * magnitude;
}

/** Ticks from 0 to the first round value at or above `max`. */
export function niceTicks(max: number, count = 5): number[] {
  const step = niceStep(max, count);
  const top = Math.ceil(max / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let k = 0; k * step <= top + step * 1e-9; k++) ticks.push(Number((k * step).toPrecision(12)));
  return ticks;
}
