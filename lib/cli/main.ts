#!/usr/bin/env tsx
/**
 * Portolan command line: `npm run -s portolan -- <group> <command> [options]`.
 * Each group lives in its own module so a command never loads another's dependencies.
 * Exit codes: 0 ok, 1 the input was refused (bad file, failed check), 2 usage error.
 */
import type { CliIo } from "./io";
import { defaultIo } from "./io";

type Group = { run(args: string[], io: CliIo): Promise<number> };

const groups: Record<string, () => Promise<Group>> = {
  toolpath: () => import("./toolpath"),
  cloud: () => import("./cloud"),
  flow: () => import("./flow"),
  program: () => import("./program"),
  audit: () => import("./audit"),
  storage: () => import("./storage"),
};

export async function main(argv: string[], io: CliIo = defaultIo): Promise<number> {
  const [group, ...rest] = argv;
  const load = group ? groups[group] : undefined;
  if (!load) {
    io.err(`usage: portolan <${Object.keys(groups).join("|")}> <command> [options]`);
    return 2;
  }
  const mod = await load();
  return mod.run(rest, io);
}

const isEntry = process.argv[1] && /lib[\\/]cli[\\/]main\.ts$/.test(process.argv[1]);
if (isEntry) {
  main(process.argv.slice(2)).then(
    (code) => {
      process.exitCode = code;
    },
    (err: unknown) => {
      process.stderr.write(`portolan: ${err instanceof Error ? err.message : String(err)}\n`);
      process.exitCode = 1;
    },
  );
}
