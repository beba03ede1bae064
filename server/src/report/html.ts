// Escaping for every string that came from a script, a record or a file name, shared by the
// report and the editor's ladder view.
const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for use in HTML/SVG content and in double- or single-quoted attributes. */
export function escapeHtml(text: string): string {
  return String(text).replace(/[&<>"']/g, (c) => ESCAPES[c]);
}
