import type { CliIo } from "./io";

// Placeholder until the cloud commands land.
export async function run(_args: string[], io: CliIo): Promise<number> {
  io.err("portolan cloud: not available yet");
  return 2;
}
