// The facts of a stimulus script that records rows refer to: rung names and numbers, each rung's
// paces and the script's @baseline. Read with the script parser and the settings table only (no
// word data needed), so looking up a script costs little.
import { applySettings, defaultOptions } from '../options';
import { parseScript } from '../parse';
import type { AnalysisOptions } from '../types';
import type { ScriptFacts } from './types';

export function scriptFacts(text: string, base: AnalysisOptions = defaultOptions()): ScriptFacts {
  const script = parseScript(text);
  const { options } = applySettings(base, script.header, 'script');
  return {
    baseline: options.baseline,
    rungs: script.rungs.map((r) => {
      const own = r.settings.some((s) => s.key === 'pace' || s.key === 'paces');
      return { name: r.name, line: r.line, paces: own ? applySettings(options, r.settings, 'rung').options.paces : options.paces };
    }),
  };
}

/** The rung a cell names: a 1-based number, or a name (case and surrounding spaces ignored). */
export function findRung(facts: ScriptFacts, written: string): number | null {
  const w = written.trim();
  if (/^\d+$/.test(w)) {
    const i = Number(w) - 1;
    return i >= 0 && i < facts.rungs.length ? i : null;
  }
  const lower = w.toLowerCase();
  const i = facts.rungs.findIndex((r) => r.name.trim().toLowerCase() === lower);
  return i >= 0 ? i : null;
}
