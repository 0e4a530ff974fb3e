/**
 * The command line: the same checker, setup adapter and deck exporter as the app, JSON in and out.
 * Refusals go to stderr as `field: why` lines with exit code 2, never as a stack trace.
 */
import { parseArgs } from './cli/args.js';
import { checklistCommand } from './cli/checklist.js';
import { checkCommand, netlistCommand, searchCommand } from './cli/commands.js';
import { CliError } from './cli/errors.js';
import { usage } from './cli/help.js';
import { backupCommand, exportCommand, importCommand, partsCsvCommand, restoreCommand } from './cli/records.js';

const commands: Record<string, (args: ReturnType<typeof parseArgs>) => string | Promise<string>> = {
  check: checkCommand,
  search: searchCommand,
  netlist: netlistCommand,
  checklist: checklistCommand,
  export: exportCommand,
  import: importCommand,
  backup: backupCommand,
  restore: restoreCommand,
  'parts-csv': partsCsvCommand,
};
const names = 'check, search, netlist, checklist, export, import, backup, restore or parts-csv';

export async function runCli(argv: readonly string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  const args = parseArgs(argv);
  if (args.flags.get('help') === true || args.command === 'help') return { code: 0, stdout: usage, stderr: '' };
  if (args.command === null) return { code: 2, stdout: '', stderr: `Give a command: ${names}.\n\n${usage}` };
  const run = commands[args.command];
  if (!run) return { code: 2, stdout: '', stderr: `Unknown command "${args.command}": use ${names} (or --help).\n` };
  try {
    return { code: 0, stdout: await run(args), stderr: '' };
  } catch (e) {
    if (e instanceof CliError) return { code: e.exitCode, stdout: '', stderr: `${e.message}\n` };
    const message = e instanceof Error ? e.message : String(e);
    return { code: 1, stdout: '', stderr: `Internal fault: ${message}\nPlease report this with the input file.\n` };
  }
}

const result = await runCli(process.argv.slice(2));
if (result.stdout) process.stdout.write(result.stdout);
if (result.stderr) process.stderr.write(result.stderr);
process.exitCode = result.code;
