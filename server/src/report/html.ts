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

/**
 * The start of a Rungs page up to its open body: the policy, the title and the one style sheet
 * (with the page's nonce in a webview). Shared by the ladder view, the report and the practice page. The policy and
 * nonce are the project's own strings (quotes in a policy must stay as written), never user text.
 */
export function documentHead(o: { csp: string; title: string; style: string; nonce?: string }): string {
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="UTF-8">
<meta http-equiv="Content-Security-Policy" content="${o.csp}">
<meta name="viewport" content="width=device-width, initial-scale=1.0">
<meta name="referrer" content="no-referrer">
<title>${escapeHtml(o.title)}</title>
<style${o.nonce ? ` nonce="${o.nonce}"` : ''}>${o.style}</style>
</head>
<body>`;
}
