// The session plan of a script: per rung, how long it takes at each of its paces with the gaps
// between items, from the cue timing plan (core/timing.ts), delivered in unison and as echo.
import { formatLength, sessionLengths, type SessionLengths } from '../core/timing';
import type { Analysis } from '../core/types';
import { escapeHtml } from './html';

export interface PlanLength {
  pace: string;
  seconds: number;
}

export interface ReportPlan {
  /** Seconds between items; the echo response window as a multiple of the model's length. */
  gap: number;
  echoWindow: number;
  /** Seconds added after phrase-break punctuation inside an item. */
  phrasePause: number;
  modes: { mode: 'unison' | 'echo'; rungs: { name: string; line: number; paces: PlanLength[] }[]; script: PlanLength[] }[];
}

function plain(l: SessionLengths): ReportPlan['modes'][number] {
  return {
    mode: l.mode,
    rungs: l.rungs.map((r) => ({ name: r.name, line: r.line + 1, paces: r.paces.map((p) => ({ pace: p.pace.label, seconds: p.seconds })) })),
    script: l.script.map((p) => ({ pace: p.pace.label, seconds: p.seconds })),
  };
}

export function buildPlan(a: Analysis): ReportPlan {
  return {
    gap: a.options.timing.gap,
    echoWindow: a.options.timing.echoWindow,
    phrasePause: a.options.timing.phrasePause,
    modes: [plain(sessionLengths(a, 'unison')), plain(sessionLengths(a, 'echo'))],
  };
}

const lengths = (ps: PlanLength[]): string => ps.map((p) => `${escapeHtml(formatLength(p.seconds))} at ${escapeHtml(p.pace)}`).join('<br>') || '–';

export function renderPlan(plan: ReportPlan): string {
  const [unison, echo] = plan.modes;
  const rows = unison.rungs.map(
    (r, i) => `<tr><td>${escapeHtml(r.name)}</td><td>${lengths(r.paces)}</td><td>${lengths(echo.rungs[i]?.paces ?? [])}</td></tr>`,
  );
  rows.push(`<tr class="total"><td>Whole script (rungs one after another)</td><td>${lengths(unison.script)}</td><td>${lengths(echo.script)}</td></tr>`);
  return (
    '<section class="plan"><h3>Session plan</h3>' +
    `<p>Time to run each rung once at each of its paces, from the cue timing plan: a gap of ${plan.gap} s between items` +
    `${plan.phrasePause ? `, ${plan.phrasePause} s after phrase-break punctuation` : ''}; as echo, each model is followed by a response window of ${plan.echoWindow} × its length.</p>` +
    `<table class="plain"><thead><tr><th>Rung</th><th>In unison</th><th>As echo</th></tr></thead><tbody>${rows.join('')}</tbody></table></section>`
  );
}
