import type { CliIo } from "./io";

// Placeholder until the toolpath commands land.
export async function run(_args: string[], io: CliIo): Promise<number> {
  io.err("portolan toolpath: not available yet");
  return 2;
}
