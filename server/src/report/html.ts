// Escaping for every string that came from a script, a record or a file name, shared by the
// report and the editor's ladder view.
const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for use in HTML/SVG content and in double- or single-quoted attributes. */
export function escapeHtml(text: string): string {
  return String(text).replace(/[&<>"']/g, (c) => ESCAPES[c]);
}

/**
 * The Content-Security-Policy of the extension's webviews (the ladder view and the report): only
 * the page's own nonce may style or script it; images and fonts only from the webview itself.
 */
export function webviewPolicy(o: { nonce: string; cspSource: string }): string {
  return [
    "default-src 'none'",
    `style-src 'nonce-${o.nonce}'`,
    `script-src 'nonce-${o.nonce}'`,
    `img-src ${o.cspSource} data:`,
    `font-src ${o.cspSource}`,
  ].join('; ');
}
