// Editor settings of the `rungs` section (workspace/configuration, scope: resource). One typed
// object with defaults, mirrored by the VS Code extension's package.json, so both halves agree.
// Layering (config/resolve.ts): defaults < editor settings < workspace config files < header.
import { DEFAULT_WEIGHTS } from '../core/difficulty';
import { parsePaces } from '../core/pace';
import type { DifficultyWeights, WcmOptions } from '../core/types';
import { DEFAULT_WCM_OPTIONS } from '../core/wcm';

export type RuleSetting = 'error' | 'warning' | 'info' | 'hint' | 'off';

export interface RungsSettings {
  /** Target paces, written as in a script header: "1, 1.5, 2 wps". */
  paces: string;
  /** The client's unassisted rate in words per second, or null when unknown. */
  baseline: number | null;
  /** Largest change of median difficulty between neighbouring rungs, 0-100 points. */
  maxStep: number;
  weights: DifficultyWeights;
  wcm: WcmOptions;
  /** Severity per rule id; "off" silences a rule. */
  rules: Record<string, RuleSetting>;
  inlayHints: { enabled: boolean };
  /** Workspace lexicon files (relative to the workspace folder, or absolute). */
  lexiconFiles: string[];
  trace: { server: 'off' | 'messages' | 'verbose' };
}

export const DEFAULT_SETTINGS: RungsSettings = {
  paces: '1, 1.5, 2 wps',
  baseline: null,
  maxStep: 15,
  weights: { ...DEFAULT_WEIGHTS },
  wcm: { ...DEFAULT_WCM_OPTIONS },
  rules: {},
  inlayHints: { enabled: true },
  lexiconFiles: [],
  trace: { server: 'off' },
};

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const num = (v: unknown, fallback: number, min = 0): number =>
  typeof v === 'number' && Number.isFinite(v) && v >= min ? v : fallback;
const bool = (v: unknown, fallback: boolean): boolean => (typeof v === 'boolean' ? v : fallback);
const SEVERITY_LIST: readonly RuleSetting[] = ['error', 'warning', 'info', 'hint', 'off'];
const SEVERITIES = new Set<string>(SEVERITY_LIST);
/** "error, warning, info, hint or off", from the one list. */
const SEVERITY_WORDS = `${SEVERITY_LIST.slice(0, -1).join(', ')} or ${SEVERITY_LIST[SEVERITY_LIST.length - 1]}`;

/**
 * Reads whatever the client sent (possibly null, partial or mistyped) into complete settings.
 * Unreadable values fall back to the default and are named in `warnings`, never thrown.
 */
export function normalizeSettings(raw: unknown): { settings: RungsSettings; warnings: string[] } {
  const warnings: string[] = [];
  const d = DEFAULT_SETTINGS;
  const r = isObject(raw) ? raw : {};
  const w = isObject(r.weights) ? r.weights : {};
  const wcm = isObject(r.wcm) ? r.wcm : {};
  const rules: Record<string, RuleSetting> = {};
  if (isObject(r.rules)) {
    for (const [id, sev] of Object.entries(r.rules)) {
      if (typeof sev === 'string' && SEVERITIES.has(sev)) rules[id] = sev as RuleSetting;
      else warnings.push(`rungs.rules.${id}: "${String(sev)}" is not ${SEVERITY_WORDS}`);
    }
  }
  let paces = typeof r.paces === 'string' && r.paces.trim() ? r.paces : d.paces;
  if (paces !== d.paces && parsePaces(paces).error) {
    warnings.push(`rungs.paces: ${parsePaces(paces).error}; the default is used`);
    paces = d.paces;
  }
  const trace = isObject(r.trace) && typeof r.trace.server === 'string' ? r.trace.server : 'off';
  return {
    settings: {
      paces,
      baseline: typeof r.baseline === 'number' && r.baseline > 0 ? r.baseline : null,
      maxStep: num(r.maxStep, d.maxStep, 0),
      weights: {
        length: num(w.length, d.weights.length),
        complexity: num(w.complexity, d.weights.complexity),
        rarity: num(w.rarity, d.weights.rarity),
      },
      wcm: {
        hAsFricative: bool(wcm.hAsFricative, d.wcm.hAsFricative),
        clustersWithinSyllable: bool(wcm.clustersWithinSyllable, d.wcm.clustersWithinSyllable),
        secondaryStressIsInitial: bool(wcm.secondaryStressIsInitial, d.wcm.secondaryStressIsInitial),
      },
      rules,
      inlayHints: { enabled: bool(isObject(r.inlayHints) ? r.inlayHints.enabled : undefined, true) },
      lexiconFiles: Array.isArray(r.lexiconFiles) ? r.lexiconFiles.filter((f): f is string => typeof f === 'string') : [],
      trace: { server: trace === 'messages' || trace === 'verbose' ? trace : 'off' },
    },
    warnings,
  };
}

/**
 * Editor settings in the shape of a config file, for the resolver's editor layer (below
 * workspace config files and the script header): keys as in a script header without the "@".
 */
export function toConfigObject(s: RungsSettings): Record<string, unknown> {
  const out: Record<string, unknown> = {
    paces: s.paces,
    'max-step': s.maxStep,
    weights: { ...s.weights },
    'wcm-h-fricative': s.wcm.hAsFricative,
    'wcm-syllable-clusters': s.wcm.clustersWithinSyllable,
    'wcm-secondary-stress': s.wcm.secondaryStressIsInitial,
    rules: { ...s.rules },
  };
  if (s.baseline !== null) out.baseline = s.baseline;
  if (s.lexiconFiles.length) out.lexicon = [...s.lexiconFiles];
  return out;
}
