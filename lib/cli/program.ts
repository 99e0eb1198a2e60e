import type { CliIo } from "./io";

// Placeholder until the program commands land.
export async function run(_args: string[], io: CliIo): Promise<number> {
  io.err("portolan program: not available yet");
  return 2;
}
