// Editor settings of the `rungs` section (workspace/configuration, scope: resource). One typed
// object with defaults, mirrored by the VS Code extension's package.json, so both halves agree.
// Layering (config/resolve.ts): defaults < editor settings < workspace config files < header.
import { defaultOptions, SETTINGS, settingText, type SettingSpec } from '../core/settings';
import { stepTooBig } from '../rules/stepTooBig';
import { thinRung } from '../rules/thinRung';

export type RuleSetting = 'error' | 'warning' | 'info' | 'hint' | 'off';

/** The table's settings the editor offers (`rungs.<editor.name>`), in table order. */
const EDITOR_SETTINGS = SETTINGS.filter((s): s is SettingSpec & { editor: NonNullable<SettingSpec['editor']> } => Boolean(s.editor));

export interface RungsSettings {
  /**
   * Analysis settings from the table, by config-file key (`max-step`), in config-file form; a
   * setting the user left unset (or set unreadably) holds its default.
   */
  analysis: Record<string, unknown>;
  /** Severity per rule id; "off" silences a rule. */
  rules: Record<string, RuleSetting>;
  inlayHints: { enabled: boolean };
  /** Workspace lexicon files (relative to the workspace folder, or absolute). */
  lexiconFiles: string[];
  trace: { server: 'off' | 'messages' | 'verbose' };
}

export const DEFAULT_SETTINGS: RungsSettings = {
  analysis: Object.fromEntries(EDITOR_SETTINGS.map((s) => [s.key, s.default])),
  rules: {},
  inlayHints: { enabled: true },
  lexiconFiles: [],
  trace: { server: 'off' },
};

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const bool = (v: unknown, fallback: boolean): boolean => (typeof v === 'boolean' ? v : fallback);
const SEVERITY_LIST: readonly RuleSetting[] = ['error', 'warning', 'info', 'hint', 'off'];
const SEVERITIES = new Set<string>(SEVERITY_LIST);
/** "error, warning, info, hint or off", from the one list. */
const SEVERITY_WORDS = `${SEVERITY_LIST.slice(0, -1).join(', ')} or ${SEVERITY_LIST[SEVERITY_LIST.length - 1]}`;

/** The value at a dotted path of the client's object (`wcm.hAsFricative`). */
function at(raw: Record<string, unknown>, path: string): unknown {
  let v: unknown = raw;
  for (const part of path.split('.')) v = isObject(v) ? v[part] : undefined;
  return v;
}

/**
 * Reads whatever the client sent (possibly null, partial or mistyped) into complete settings.
 * Each table setting is read by its own reader (as a header value would be); unreadable values
 * fall back to the default and are named in `warnings`, never thrown.
 */
export function normalizeSettings(raw: unknown): { settings: RungsSettings; warnings: string[] } {
  const warnings: string[] = [];
  const r = isObject(raw) ? raw : {};
  const analysis: Record<string, unknown> = {};
  for (const spec of EDITOR_SETTINGS) {
    const v = at(r, spec.editor.name);
    analysis[spec.key] = spec.default;
    if (v === undefined || v === null) continue;
    const text = settingText(v);
    const error = text === null || !text.trim() ? `cannot read ${JSON.stringify(v)}` : spec.apply(text, defaultOptions());
    if (error) warnings.push(`rungs.${spec.editor.name}: ${error}; the default is used`);
    else analysis[spec.key] = v;
  }
  const rules: Record<string, RuleSetting> = {};
  if (isObject(r.rules)) {
    for (const [id, sev] of Object.entries(r.rules)) {
      if (typeof sev === 'string' && SEVERITIES.has(sev)) rules[id] = sev as RuleSetting;
      else warnings.push(`rungs.rules.${id}: "${String(sev)}" is not ${SEVERITY_WORDS}`);
    }
  }
  const trace = isObject(r.trace) && typeof r.trace.server === 'string' ? r.trace.server : 'off';
  return {
    settings: {
      analysis,
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
  const out: Record<string, unknown> = { rules: { ...s.rules } };
  for (const [key, v] of Object.entries(s.analysis)) if (v !== null && v !== undefined) out[key] = v;
  if (s.lexiconFiles.length) out.lexicon = [...s.lexiconFiles];
  return out;
}

/** Editor settings that are not analysis settings: how the editor shows them in package.json. */
const EDITOR_ONLY: Record<string, Record<string, unknown>> = {
  'rungs.rules': {
    type: 'object',
    default: {},
    additionalProperties: { type: 'string', enum: ['error', 'warning', 'info', 'hint', 'off'] },
    markdownDescription:
      'Severity per rule id (`error`, `warning`, `info`, `hint`, or `off` to silence it), e.g. ' +
      `\`{ "${stepTooBig.id}": "error", "${thinRung.id}": "off" }\`. The rule id is shown with each problem.`,
  },
  'rungs.inlayHints.enabled': { type: 'boolean', default: true, markdownDescription: 'Show difficulty and duration at the end of each item.' },
  'rungs.lexiconFiles': {
    type: 'array',
    items: { type: 'string' },
    default: [],
    markdownDescription:
      'Workspace lexicon files of pronunciations (`Okafor = OW0 K AA1 F AO0 R` per line), relative to the workspace folder or absolute, and inside it (files elsewhere are refused). `@say` lines in a script win over them.',
  },
  'rungs.trace.server': {
    type: 'string',
    enum: ['off', 'messages', 'verbose'],
    default: 'off',
    enumDescriptions: ['No trace.', 'Requests and notifications.', 'Requests and notifications with their parameters.'],
    markdownDescription: 'Traces the communication between VS Code and the Rungs language server in the "Rungs" output channel.',
  },
};

/** The JSON schema of one table setting as an editor setting. */
function schemaOf(spec: SettingSpec & { editor: NonNullable<SettingSpec['editor']> }): Record<string, unknown> {
  const type =
    spec.type === 'yes-no' ? 'boolean' : spec.type === 'weights' ? 'object' : spec.type === 'paces' || spec.type === 'choice' || spec.type === 'text' || spec.type === 'labels' ? 'string' : 'number';
  const out: Record<string, unknown> = { type: spec.default === null ? [type, 'null'] : type, default: spec.default };
  if (spec.range && type === 'number') Object.assign(out, { minimum: spec.range.min, maximum: spec.range.max });
  if (spec.values && type === 'string' && spec.type === 'choice') out.enum = spec.values;
  return { ...out, ...spec.editor.schema, markdownDescription: spec.editor.markdownDescription };
}

/** package.json's `contributes.configuration`, generated from the table (a test keeps them equal). */
export function editorConfiguration(): { title: string; properties: Record<string, Record<string, unknown>> } {
  const entries: [string, Record<string, unknown>][] = [
    ...EDITOR_SETTINGS.map((s): [string, Record<string, unknown>] => [`rungs.${s.editor.name}`, schemaOf(s)]),
    ...Object.entries(EDITOR_ONLY),
  ];
  return {
    title: 'Rungs',
    properties: Object.fromEntries(entries.map(([name, schema], i) => [name, { ...schema, scope: 'resource', order: i + 1 }])),
  };
}
