/** HTML escaping for the e-mail templates (text parts are plain). */
export function escapeHtml(s: string): string {
  return s
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

export interface RenderedEmail {
  subject: string;
  text: string;
  html: string;
}

/** A minimal, client-safe HTML body: paragraphs and one link button. */
export function layoutHtml(paragraphs: string[], link: { href: string; label: string }, footer: string): string {
  const ps = paragraphs.map((p) => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join("");
  const href = escapeHtml(link.href);
  return `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#1f2933;line-height:1.5">`
    + `<div style="max-width:560px;margin:24px auto">${ps}`
    + `<p style="margin:20px 0"><a href="${href}" style="background:#0f766e;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(link.label)}</a></p>`
    + `<p style="margin:0 0 12px;font-size:13px;color:#52606d">If the button does not work, open this address: ${href}</p>`
    + `<p style="margin:24px 0 0;font-size:12px;color:#7b8794">${escapeHtml(footer)}</p></div></body></html>`;
}
