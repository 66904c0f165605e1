/**
 * Entry point of the `stripwright` command line: a thin face over core/.
 * Bundled by scripts/build-cli.mjs into dist-cli/stripwright.mjs, which bin/stripwright.mjs runs.
 */
import { COMMANDS } from './commands/index.ts';
import { UsageError, type CliCommand, type CliIo } from './registry.ts';
import { VERSION } from './version.ts';
import { explainErrno } from '../electron/files/atomic-write.ts';

function overview(): string {
  const width = Math.max(4, ...COMMANDS.map((c) => c.name.length));
  const lines = COMMANDS.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`);
  return [
    'Usage: stripwright <command> [options]',
    '',
    'Commands:',
    ...lines,
    `  ${'help'.padEnd(width)}  Show the usage of a command: stripwright help <command>`,
    '',
    'Options:',
    '  --help, -h     Show this overview',
    '  --version, -V  Print the version',
  ].join('\n');
}

export async function runCli(argv: string[], io: CliIo): Promise<number> {
  const [first, ...rest] = argv;
  if (first === undefined || first === '--help' || first === '-h') { io.out(overview()); return 0; }
  if (first === '--version' || first === '-V') { io.out(VERSION); return 0; }
  if (first === 'help') {
    const cmd = COMMANDS.find((c) => c.name === rest[0]);
    if (rest[0] === undefined) { io.out(overview()); return 0; }
    if (!cmd) { io.err(`stripwright: unknown command '${rest[0]}'.`); io.err(overview()); return 2; }
    io.out(cmd.usage); return 0;
  }
  if (first.startsWith('-')) { io.err(`stripwright: unknown option '${first}'; options come after a command.`); io.err(overview()); return 2; }
  const cmd: CliCommand | undefined = COMMANDS.find((c) => c.name === first);
  if (!cmd) { io.err(`stripwright: unknown command '${first}'.`); io.err(overview()); return 2; }
  if (rest.includes('--help') || rest.includes('-h')) { io.out(cmd.usageFor?.(rest) ?? cmd.usage); return 0; }
  try {
    return await cmd.run(rest, io);
  } catch (err) {
    if (err instanceof UsageError) { io.err(`stripwright ${cmd.name}: ${err.message}`); io.err(cmd.usage); return 2; }
    // node:util parseArgs reports unknown or malformed flags with these codes.
    const code = (err as { code?: string }).code;
    if (code && code.startsWith('ERR_PARSE_ARGS')) { io.err(`stripwright ${cmd.name}: ${(err as Error).message}`); io.err(cmd.usage); return 2; }
    // A file-system refusal no command put in words: say what was wrong, never the bare errno code.
    if (code && /^E[A-Z0-9]+$/.test(code)) {
      const path = (err as NodeJS.ErrnoException).path;
      io.err(`stripwright ${cmd.name}: ${path ? `${path}: ` : ''}${explainErrno(err as NodeJS.ErrnoException)}`);
      return 1;
    }
    throw err;
  }
}

const isEntry = typeof process !== 'undefined' && process.argv[1] !== undefined && /stripwright(\.mjs)?$|cli[\\/]main\.ts$/.test(process.argv[1]);
if (isEntry) {
  const io: CliIo = { out: (t) => process.stdout.write(t + '\n'), err: (t) => process.stderr.write(t + '\n'), cwd: process.cwd() };
  runCli(process.argv.slice(2), io).then(
    (code) => { process.exitCode = code; },
    (err) => { process.stderr.write(`stripwright: internal error: ${(err as Error).stack ?? err}\n`); process.exitCode = 1; },
  );
}
