/** Revision letters: A … Z, then AA, AB … (like spreadsheet columns), never reused. */

export function letterToNumber(letter: string): number {
  if (!/^[A-Z]+$/.test(letter)) throw new Error(`not a revision letter: ${JSON.stringify(letter)}`);
  let n = 0;
  for (const ch of letter) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n;
}

export function numberToLetter(n: number): string {
  if (!Number.isInteger(n) || n < 1) throw new Error(`revision numbers start at 1, got ${n}`);
  let out = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    out = String.fromCharCode(65 + r) + out;
    n = Math.floor((n - 1) / 26);
  }
  return out;
}

/** The letter after the highest one in use (A when there is none). */
export function nextLetter(existing: string[]): string {
  const highest = existing.reduce((m, l) => Math.max(m, letterToNumber(l)), 0);
  return numberToLetter(highest + 1);
}
