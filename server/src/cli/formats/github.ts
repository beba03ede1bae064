// GitHub Actions workflow commands: `::warning file=F,line=L,col=C,...::message`, one per problem,
// so problems show as annotations on the changed lines of a pull request.
import type { Severity } from '../../core/types';
import type { LintRun } from './types';

const LEVEL: Record<Severity, string> = { error: 'error', warning: 'warning', info: 'notice', hint: 'notice' };

const escapeData = (s: string) => s.replace(/%/g, '%25').replace(/\r/g, '%0D').replace(/\n/g, '%0A');
const escapeProperty = (s: string) => escapeData(s).replace(/:/g, '%3A').replace(/,/g, '%2C');

export function formatGithub(run: LintRun): string {
  const lines: string[] = [];
  for (const r of run.results) {
    for (const p of r.problems) {
      const props = [
        `file=${escapeProperty(r.file)}`,
        `line=${p.line + 1}`,
        `col=${p.character + 1}`,
        `endLine=${p.endLine + 1}`,
        `endColumn=${p.endCharacter + 1}`,
        `title=${escapeProperty(`rungs ${p.rule}`)}`,
      ];
      lines.push(`::${LEVEL[p.severity]} ${props.join(',')}::${escapeData(p.message)}`);
    }
  }
  return lines.length ? `${lines.join('\n')}\n` : '';
}
