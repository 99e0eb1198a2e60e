import type { CliIo } from "./io";

// Placeholder until the storage maintenance commands land.
export async function run(_args: string[], io: CliIo): Promise<number> {
  io.err("portolan storage: not available yet");
  return 2;
}
