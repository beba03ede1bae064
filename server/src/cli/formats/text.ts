// The compact human format: one line per problem, `file:line:col severity rule message`, then a
// summary line. Colour (ANSI) only when asked, i.e. on a terminal.
import { terminalSafe } from '../../core/excerpt';
import type { Severity } from '../../core/types';
import { isBatchFix } from '../../rules/fixes';
import { counts, type LintRun } from './types';

const COLOURS: Record<Severity, string> = { error: '31', warning: '33', info: '36', hint: '90' };

export function formatLintText(run: LintRun, colour = false): string {
  const paint = (code: string, s: string) => (colour ? `\u001b[${code}m${s}\u001b[0m` : s);
  const lines: string[] = [];
  const all = run.results.flatMap((r) => r.problems);
  for (const r of run.results) {
    for (const p of r.problems) {
      lines.push(`${paint('1', `${terminalSafe(r.file)}:${p.line + 1}:${p.character + 1}`)} ${paint(COLOURS[p.severity], p.severity)} ${paint('2', p.rule)} ${terminalSafe(p.message)}`);
    }
  }
  const c = counts(all);
  // Only fixes --fix would apply; quick-fix-only ones (batch: false) are left to the editor.
  const fixable = all.filter((p) => isBatchFix(p.fix)).length;
  const files = run.results.filter((r) => r.problems.length).length;
  const plural = (n: number, w: string) => `${n} ${w}${n === 1 ? '' : 's'}`;
  if (!all.length) lines.push(`${plural(run.results.length, 'file')} checked: no problems`);
  else {
    const parts = [plural(c.error, 'error'), plural(c.warning, 'warning'), `${c.info} info`];
    if (c.hint) parts.push(plural(c.hint, 'hint'));
    lines.push(
      '',
      `${plural(all.length, 'problem')} (${parts.join(', ')}) in ${files} of ${plural(run.results.length, 'file')}` +
        (fixable ? `; ${fixable} fixable with --fix` : ''),
    );
  }
  return `${lines.join('\n')}\n`;
}
