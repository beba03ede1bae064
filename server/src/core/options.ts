// Analysis options: built-in defaults, then a workspace config (already read into a plain object
// by the caller), then the script's own header, each applied by the one table of settings
// (core/settings.ts), so parsing, validation, completion and docs never disagree.
import { finding, type Finding } from './findings';
import { nearestName } from './nearest';
import { defaultOptions, SETTING_NAMES, settingSpec } from './settings';
import type { AnalysisOptions, Range, Setting } from './types';

export { defaultOptions };

/** The nearest known key to a misspelt one, when it is close enough to be a likely typo. */
export function nearestKey(name: string): string | null {
  const best = nearestName(name, SETTING_NAMES);
  return best === null ? null : settingSpec(best)!.key;
}

const keyRange = (s: Setting): Range => ({ line: s.line, character: s.keyStart, endLine: s.line, endCharacter: s.keyEnd });
const valueRange = (s: Setting): Range => ({ line: s.line, character: s.valueStart, endLine: s.line, endCharacter: Math.max(s.valueEnd, s.valueStart + 1) });

/**
 * Applies settings to options in order. Unknown keys (with the nearest known key) and values that
 * cannot be read (with what the key takes) become findings; the rules word them. `scope` says
 * where the settings were written: a script header, a rung, or a config layer (a file or the
 * editor settings).
 */
export function applySettings(
  base: AnalysisOptions,
  settings: Setting[],
  scope: 'script' | 'rung' | 'config',
): { options: AnalysisOptions; findings: Finding[] } {
  const o: AnalysisOptions = { ...base, weights: { ...base.weights }, wcm: { ...base.wcm }, timing: { ...base.timing } };
  const findings: Finding[] = [];
  for (const s of settings) {
    const spec = settingSpec(s.key);
    if (!spec) {
      findings.push(finding(keyRange(s), { kind: 'unknown-setting', key: s.key, nearest: nearestKey(s.key), where: 'script', fixable: true }));
      continue;
    }
    if (scope === 'rung' && spec.scope === 'script') {
      findings.push(finding(keyRange(s), { kind: 'script-key-on-rung', key: spec.key }));
      continue;
    }
    if (scope !== 'config' && spec.recordsOnly) {
      findings.push(finding(keyRange(s), { kind: 'records-key-in-script', key: spec.key }));
      continue;
    }
    if (!s.value.trim() && spec.key !== 'title') {
      findings.push(finding(keyRange(s), { kind: 'missing-value', key: spec.key, example: spec.example }));
      continue;
    }
    const error = spec.apply(s.value, o);
    if (error) findings.push(finding(valueRange(s), { kind: 'unreadable-value', key: spec.key, expected: error }));
  }
  return { options: o, findings };
}
