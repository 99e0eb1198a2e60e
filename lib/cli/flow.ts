import type { CliIo } from "./io";

// Placeholder until the flow commands land.
export async function run(_args: string[], io: CliIo): Promise<number> {
  io.err("portolan flow: not available yet");
  return 2;
}
