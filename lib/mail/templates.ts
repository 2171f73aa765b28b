/**
 * Every e-mail is built here from one layout, as plain text and as HTML. Values from people
 * (names, trial titles, comments) are escaped; links are absolute (see urls.ts).
 */
export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

export interface MailContent {
  subject: string;
  greeting?: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  /** Further links listed under the text, as in a digest. */
  items?: { text: string; url: string }[];
  footer?: string;
}

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (character) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[character]!);
}

const standardFooter = "You receive this because you have an account at Hoebench. Choose which notices you get under Settings.";

export function renderMail(content: MailContent): RenderedMail {
  const footer = content.footer ?? standardFooter;
  const text = [
    content.greeting,
    ...content.paragraphs,
    content.action ? `${content.action.label}: ${content.action.url}` : undefined,
    content.items?.length ? content.items.map((item) => `- ${item.text}\n  ${item.url}`).join("\n") : undefined,
    "--",
    footer,
  ]
    .filter((part): part is string => Boolean(part))
    .join("\n\n");

  const paragraph = (value: string) => `<p style="margin:0 0 14px">${escapeHtml(value)}</p>`;
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(content.subject)}</title></head>
<body style="margin:0;padding:24px;background:#f6f4ef;font-family:Arial,Helvetica,sans-serif;color:#2b2520;line-height:1.5">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #e3ddd2;border-radius:8px;padding:24px">
<p style="margin:0 0 18px;font-weight:bold;color:#3d6b2f">Hoebench</p>
${content.greeting ? paragraph(content.greeting) : ""}
${content.paragraphs.map(paragraph).join("\n")}
${content.action ? `<p style="margin:22px 0"><a href="${escapeHtml(content.action.url)}" style="background:#4a7f39;color:#ffffff;padding:10px 16px;border-radius:4px;text-decoration:none;font-weight:bold">${escapeHtml(content.action.label)}</a></p>
<p style="margin:0 0 14px;font-size:13px;color:#6b6259">Or copy this address into your browser: ${escapeHtml(content.action.url)}</p>` : ""}
${content.items?.length ? `<ul style="padding-left:20px">${content.items.map((item) => `<li style="margin-bottom:8px"><a href="${escapeHtml(item.url)}" style="color:#3d6b2f">${escapeHtml(item.text)}</a></li>`).join("")}</ul>` : ""}
<p style="margin:24px 0 0;font-size:12px;color:#6b6259">${escapeHtml(footer)}</p>
</div></body></html>`;
  return { subject: content.subject, text, html };
}
