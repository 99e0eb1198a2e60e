/** Output channels of the CLI, injectable so tests can capture what a command prints. */
export type CliIo = {
  out(text: string): void;
  err(text: string): void;
};

export const defaultIo: CliIo = {
  out: (text) => process.stdout.write(text.endsWith("\n") ? text : `${text}\n`),
  err: (text) => process.stderr.write(text.endsWith("\n") ? text : `${text}\n`),
};
