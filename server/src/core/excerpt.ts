// Text the user wrote, quoted back in a message or on a terminal. A message must never echo a whole
// line (a config file could name a secret file as a lexicon, and its lines would land in lint
// output and CI annotations) nor carry control characters that drive the terminal, so quotes are
// short and escaped.

/** Longest quote of user text in a message, in characters (README "Limits"). */
export const EXCERPT_MAX = 40;

// C0 and C1 controls, DEL, and the line and paragraph separators, which end lines in some readers.
const CONTROL = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g;

/** Control characters as escapes (`\x1b`, `\n`, `\u2028`); everything else unchanged. */
export function escapeControls(text: string): string {
  return text.replace(CONTROL, (c) => {
    if (c === '\n') return '\\n';
    if (c === '\r') return '\\r';
    if (c === '\t') return '\\t';
    const code = c.charCodeAt(0);
    return code > 0xff ? `\\u${code.toString(16).padStart(4, '0')}` : `\\x${code.toString(16).padStart(2, '0')}`;
  });
}

/** At most `max` characters of `text` (cut with "…"), control characters escaped. */
export function excerpt(text: string, max = EXCERPT_MAX): string {
  const chars = Array.from(text);
  const cut = chars.length > max ? `${chars.slice(0, max - 1).join('')}…` : text;
  return escapeControls(cut);
}

// What a terminal would act on rather than show: C0 controls but tab, DEL, C1 controls (ESC and
// CSI start colour, cursor and title sequences), and the bidirectional overrides and isolates,
// which reorder what is shown.
const TERMINAL = /[\u0000-\u0008\u000a-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/g;

/** User text for a terminal: controls escaped (`\x1b`), tabs and everything else kept. */
export function terminalSafe(text: string): string {
  return text.replace(TERMINAL, (c) => escapeControls(c) === c ? `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}` : escapeControls(c));
}
