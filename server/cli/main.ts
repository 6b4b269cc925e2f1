/**
 * `taulens <command> …`: dispatches to the sub-commands and turns their failures into exit codes. Bad input (an
 * unreadable model, wrong arguments) prints one plain message on stderr and exits with 2; anything unexpected exits
 * with 1, also with a message and no stack trace.
 */
import { IfcReadError } from '../ifc/ifc-read-error';
import { checkCommand } from './check-command';
import { type Command, type CommandIo, UsageError } from './command';
import { membersCommand } from './members-command';

const COMMANDS: readonly Command[] = [membersCommand, checkCommand];

const io: CommandIo = {
  out: (text) => process.stdout.write(text),
  err: (text) => process.stderr.write(text),
};

function overview(): string {
  const width = Math.max(...COMMANDS.map((c) => c.name.length));
  return ['usage: taulens <command> [options]', '', 'commands:', ...COMMANDS.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`), '', "'taulens <command> --help' shows a command's options."].join('\n') + '\n';
}

export async function dispatch(argv: readonly string[], streams: CommandIo = io): Promise<number> {
  const [name, ...args] = argv;
  if (name === undefined || name === '--help' || name === 'help') {
    streams.out(overview());
    return name === undefined ? 2 : 0;
  }
  const command = COMMANDS.find((c) => c.name === name);
  if (!command) {
    streams.err(`taulens: unknown command '${name}'\n\n${overview()}`);
    return 2;
  }
  if (args.includes('--help')) {
    streams.out(command.usage + '\n');
    return 0;
  }
  try {
    return await command.run(args, streams);
  } catch (error) {
    if (error instanceof UsageError) {
      streams.err(`taulens ${name}: ${error.message}\n\n${command.usage}\n`);
      return 2;
    }
    if (error instanceof IfcReadError) {
      streams.err(`taulens ${name}: ${error.message}\n`);
      return 2;
    }
    streams.err(`taulens ${name}: internal error: ${error instanceof Error ? error.message : String(error)}\n`);
    return 1;
  }
}

/** Entry used by bin.js. */
export function run(argv: readonly string[]): void {
  dispatch(argv).then(
    (code) => {
      process.exitCode = code;
    },
    () => {
      process.exitCode = 1;
    },
  );
}
