/**
 * The words of one block (one line), in reusable typed arrays so reading millions of lines
 * allocates nothing per line. Letters index 0–25 (A = 0).
 */

export const letterIndex = (letter: string): number => letter.charCodeAt(0) - 65;

export const L_A = 0;
export const L_B = 1;
export const L_C = 2;
export const L_D = 3;
export const L_F = 5;
export const L_G = 6;
export const L_H = 7;
export const L_I = 8;
export const L_J = 9;
export const L_K = 10;
export const L_L = 11;
export const L_M = 12;
export const L_P = 15;
export const L_Q = 16;
export const L_R = 17;
export const L_S = 18;
export const L_T = 19;
export const L_X = 23;
export const L_Y = 24;
export const L_Z = 25;

export const bit = (letter: number): number => 1 << letter;

/** X Y Z A B C: the words that move axes. */
export const AXIS_WORDS = bit(L_X) | bit(L_Y) | bit(L_Z) | bit(L_A) | bit(L_B) | bit(L_C);
/** Words that a plain modal motion line may carry without leaving the fast path. */
export const PLAIN_MOTION_WORDS = AXIS_WORDS | bit(L_F);

export const MAX_G_PER_BLOCK = 16;
export const MAX_M_PER_BLOCK = 8;

export type WordStorage = { values: Float64Array; gCodes: Int32Array; mCodes: Int32Array };

export class BlockWords {
  readonly values: Float64Array;
  /** Bit per letter (1 << index) for the non-G, non-M words present. */
  present = 0;
  /** G codes times ten (G1 → 10, G59.3 → 593), in text order. */
  readonly gCodes: Int32Array;
  gCount = 0;
  readonly mCodes: Int32Array;
  mCount = 0;

  /** `storage`: arrays to read and write the words in (the scanner's WebAssembly memory), else new ones. */
  constructor(storage?: WordStorage) {
    this.values = storage?.values ?? new Float64Array(26);
    this.gCodes = storage?.gCodes ?? new Int32Array(MAX_G_PER_BLOCK);
    this.mCodes = storage?.mCodes ?? new Int32Array(MAX_M_PER_BLOCK);
    if (this.values.length !== 26 || this.gCodes.length !== MAX_G_PER_BLOCK || this.mCodes.length !== MAX_M_PER_BLOCK) {
      throw new Error("BlockWords: storage of the wrong size");
    }
  }

  reset(): void {
    this.present = 0;
    this.gCount = 0;
    this.mCount = 0;
  }

  has(letter: number): boolean {
    return (this.present & (1 << letter)) !== 0;
  }

  value(letter: number): number {
    return this.values[letter];
  }

  hasG(codeTimesTen: number): boolean {
    for (let i = 0; i < this.gCount; i++) if (this.gCodes[i] === codeTimesTen) return true;
    return false;
  }

  hasM(code: number): boolean {
    for (let i = 0; i < this.mCount; i++) if (this.mCodes[i] === code) return true;
    return false;
  }
}

/** "G59.3" from 593. */
export function gName(codeTimesTen: number): string {
  return codeTimesTen % 10 === 0 ? `G${codeTimesTen / 10}` : `G${Math.floor(codeTimesTen / 10)}.${codeTimesTen % 10}`;
}
