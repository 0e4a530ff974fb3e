/**
 * The desktop app's question when the workshop will not open: the sentence, and one button per way
 * out that can work here (no "newest backup" without a readable backup; "update" is only said, as
 * the app cannot update itself), then Quit. Pure, so it is tested without Electron.
 */
import type { StartupProblem, WayOut } from '../../db/startup-problem.js';

export type StartupChoice = WayOut | 'quit';

const LABELS: Record<WayOut, string> = {
  'newest-backup': 'Open the newest backup',
  'read-only-export': 'Open read-only and export…',
  'other-folder': 'Choose another folder…',
  'close-other': 'Try again',
  'update-app': 'Quit',
};

export function startupChoices(problem: StartupProblem, newestBackup: { createdAt: string } | null): { detail: string; buttons: string[]; choices: StartupChoice[] } {
  const ways = problem.waysOut.filter((w) => w !== 'update-app' && (w !== 'newest-backup' || newestBackup !== null));
  const choices: StartupChoice[] = [...ways, 'quit'];
  const extra = newestBackup && ways.includes('newest-backup') ? ` The newest backup was made ${newestBackup.createdAt.slice(0, 16).replace('T', ' at ')} (UTC).` : '';
  return { detail: problem.sentence + extra, buttons: choices.map((c) => (c === 'quit' ? 'Quit' : LABELS[c])), choices };
}
