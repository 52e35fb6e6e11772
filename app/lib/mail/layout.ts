// The product's own mail look: one column, the forge and copper colours, system fonts. No images, no
// remote resources, no tracking pixels and no rewritten links: what is sent is all there is.

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

const FORGE_900 = "#15232e";
const FORGE_700 = "#2b4456";
const FORGE_50 = "#f3f6f8";
const COPPER_700 = "#8a4318";

/** Escapes text for an HTML body or attribute. */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
}

export type Block = { p: string } | { button: { href: string; label: string } } | { small: string } | { rows: [string, string][] };

/** The HTML part: a header band, the blocks, and a footer line saying why the mail came. */
export function mailHtml(title: string, blocks: Block[], footer: string): string {
  const body = blocks
    .map((b) => {
      if ("p" in b) return `<p style="margin:0 0 14px;line-height:1.5">${escapeHtml(b.p)}</p>`;
      if ("small" in b) return `<p style="margin:0 0 14px;font-size:13px;color:${FORGE_700};line-height:1.5">${escapeHtml(b.small)}</p>`;
      if ("rows" in b)
        return `<table role="presentation" style="border-collapse:collapse;margin:0 0 14px;width:100%">${b.rows
          .map(
            ([k, v]) =>
              `<tr><th align="left" style="padding:4px 8px 4px 0;font-weight:600;vertical-align:top">${escapeHtml(k)}</th><td style="padding:4px 0">${escapeHtml(v)}</td></tr>`,
          )
          .join("")}</table>`;
      return `<p style="margin:0 0 18px"><a href="${escapeHtml(b.button.href)}" style="display:inline-block;background:${COPPER_700};color:#ffffff;padding:10px 18px;border-radius:4px;text-decoration:none;font-weight:600">${escapeHtml(b.button.label)}</a></p><p style="margin:0 0 14px;font-size:13px;color:${FORGE_700};word-break:break-all">${escapeHtml(b.button.href)}</p>`;
    })
    .join("\n");
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>${escapeHtml(title)}</title></head>
<body style="margin:0;background:${FORGE_50};font-family:system-ui,-apple-system,'Segoe UI',sans-serif;color:${FORGE_900}">
<div style="max-width:560px;margin:0 auto;padding:24px 16px">
<div style="background:${FORGE_900};color:${FORGE_50};padding:12px 16px;font-size:18px;font-weight:700;letter-spacing:0.03em">Sealwright</div>
<div style="background:#ffffff;padding:20px 16px;border:1px solid #e2e8ed;border-top:0">
<h1 style="margin:0 0 16px;font-size:20px">${escapeHtml(title)}</h1>
${body}
</div>
<p style="font-size:12px;color:${FORGE_700};margin:12px 4px">${escapeHtml(footer)}</p>
</div></body></html>`;
}

/** The plain-text part of the same blocks. */
export function mailText(title: string, blocks: Block[], footer: string): string {
  const lines = blocks.map((b) => {
    if ("p" in b) return b.p;
    if ("small" in b) return b.small;
    if ("rows" in b) return b.rows.map(([k, v]) => `${k}: ${v}`).join("\n");
    return `${b.button.label}:\n${b.button.href}`;
  });
  return `${title}\n${"=".repeat(title.length)}\n\n${lines.join("\n\n")}\n\n-- \n${footer}\n`;
}

export function mail(subject: string, title: string, blocks: Block[], footer: string): MailContent {
  return { subject, text: mailText(title, blocks, footer), html: mailHtml(title, blocks, footer) };
}
