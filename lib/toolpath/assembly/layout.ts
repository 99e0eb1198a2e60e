/** Where things sit in the module's linear memory (read by fast-path.ts from the exports). */
export const STATE_AT: usize = 1024; // plain-moves.ts: the interpreter's state during a batch
export const QUEUE_AT: usize = 4096; // plain-moves.ts: preview points of a batch
export const QUEUE_POINTS: i32 = 4096; // 32 bytes each
export const INPUT_AT: usize = QUEUE_AT + (<usize>QUEUE_POINTS << 5); // the text to scan
