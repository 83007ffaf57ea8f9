/** Every Rigline e-mail has a plain-text and an HTML part built from the same content. */
export type MailContent = {
  subject: string;
  heading: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  footnote?: string;
};

export type RenderedMail = { subject: string; text: string; html: string };

const escapeHtml = (s: string) =>
  s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

export function renderMail(content: MailContent): RenderedMail {
  const footnote =
    content.footnote ?? "You receive this because you have an account on Rigline.";
  const text = [
    content.heading,
    "",
    ...content.paragraphs.flatMap((p) => [p, ""]),
    ...(content.action ? [`${content.action.label}: ${content.action.url}`, ""] : []),
    "—",
    footnote,
  ].join("\n");

  const html = `<!doctype html><html lang="en"><body style="margin:0;background:#f6f1e7;font-family:Arial,Helvetica,sans-serif;color:#1c2433">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0"><tr><td align="center" style="padding:24px">
<table role="presentation" width="560" cellpadding="0" cellspacing="0" style="background:#ffffff;border-radius:8px;border-top:6px solid #9c3d23">
<tr><td style="padding:24px 28px">
<p style="margin:0 0 4px;font-size:13px;letter-spacing:.08em;text-transform:uppercase;color:#5d6b5a">Rigline</p>
<h1 style="margin:0 0 16px;font-size:20px">${escapeHtml(content.heading)}</h1>
${content.paragraphs.map((p) => `<p style="margin:0 0 12px;line-height:1.5">${escapeHtml(p)}</p>`).join("\n")}
${
  content.action
    ? `<p style="margin:20px 0"><a href="${escapeHtml(content.action.url)}" style="display:inline-block;background:#1f2f4d;color:#ffffff;padding:12px 18px;border-radius:6px;text-decoration:none;font-weight:bold">${escapeHtml(content.action.label)}</a></p>
<p style="margin:0 0 12px;font-size:12px;color:#5d6b5a">Or open this address: ${escapeHtml(content.action.url)}</p>`
    : ""
}
<p style="margin:24px 0 0;font-size:12px;color:#5d6b5a">${escapeHtml(footnote)}</p>
</td></tr></table></td></tr></table></body></html>`;

  return { subject: content.subject, text, html };
}
