// The module's entry (npm run build:wasm): the line reader and the plain-move batch.
export { init, fastLine, INPUT, VALUES, PRESENT, G_COUNT, M_COUNT, G_CODES, M_CODES } from "./fast-line";
export { runPlain, POS, SUMS, MIN, MAX, TOOL_STATS, RAPID_RATE, ALARM_LO, ALARM_HI, MODE_F, MIN_LINE, MAX_LINE, MODE_I, BATCH } from "./plain-moves";
export { QUEUE_AT, QUEUE_POINTS } from "./layout";
