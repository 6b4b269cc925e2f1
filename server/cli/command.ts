/**
 * What every `taulens` sub-command provides, so that main.ts only dispatches: a later `check` command is one more file
 * implementing Command and one more entry in main.ts's list.
 */
export interface CommandIo {
  out(text: string): void;
  err(text: string): void;
}

export interface Command {
  name: string;
  /** One line for the command list. */
  summary: string;
  /** Full usage text, printed for `taulens <name> --help` and after a usage error. */
  usage: string;
  /** Resolves to the exit code: 0 done, 2 bad input (the message is already on stderr). */
  run(args: readonly string[], io: CommandIo): Promise<number>;
}

/** Wrong arguments: main.ts prints the message and the command's usage, and exits with 2. */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

/** Value of `--flag value`, or undefined; a flag given without a value is a usage error. */
export function optionValue(args: readonly string[], flag: string): string | undefined {
  const at = args.indexOf(flag);
  if (at < 0) return undefined;
  const value = args[at + 1];
  if (value === undefined || value.startsWith('--')) throw new UsageError(`${flag} needs a value`);
  return value;
}

/** Every value of a flag that may be given several times (`--sheet A --sheet B`), in order. */
export function optionValues(args: readonly string[], flag: string): string[] {
  const values: string[] = [];
  args.forEach((arg, at) => {
    if (arg !== flag) return;
    const value = args[at + 1];
    if (value === undefined || value.startsWith('--')) throw new UsageError(`${flag} needs a value`);
    values.push(value);
  });
  return values;
}

/** Arguments that are neither flags nor flag values. */
export function positionals(args: readonly string[], flagsWithValues: readonly string[]): string[] {
  const out: string[] = [];
  for (let i = 0; i < args.length; i++) {
    if (flagsWithValues.includes(args[i])) i++;
    else if (!args[i].startsWith('--')) out.push(args[i]);
  }
  return out;
}
