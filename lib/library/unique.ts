/** Turns SQLite's UNIQUE failures into a field message the form can show beside the input. */
import { AppError } from "../errors";

export function uniqueViolation<T>(run: () => T, messages: Record<string, string>): T {
  try {
    return run();
  } catch (err) {
    const message = err instanceof Error ? err.message : "";
    if (/UNIQUE constraint failed/.test(message)) {
      const field = Object.keys(messages).find((f) => message.includes(snake(f))) ?? Object.keys(messages)[0];
      throw new AppError("conflict", messages[field], { [field]: [messages[field]] });
    }
    throw err;
  }
}

const snake = (s: string) => s.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
