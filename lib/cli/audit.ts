import type { CliIo } from "./io";

// Placeholder until the audit commands land.
export async function run(_args: string[], io: CliIo): Promise<number> {
  io.err("portolan audit: not available yet");
  return 2;
}
