/**
 * Caught HTML shown in the admin page's iframe: links open in a new tab (the sandbox allows
 * popups, nothing else: no scripts, no same-origin access), and a CSP forbids scripts again.
 */
export function previewDocument(html: string): string {
  const head = `<base target="_blank"><meta http-equiv="Content-Security-Policy" content="default-src 'none'; img-src data: http: https:; style-src 'unsafe-inline'">`;
  if (/<head[^>]*>/i.test(html)) return html.replace(/<head[^>]*>/i, (match) => `${match}${head}`);
  return `<!doctype html><html><head>${head}</head><body>${html}</body></html>`;
}
