import "server-only";
import { env } from "../env";

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
}

/** A plain message with one call to action; the text part always carries the full link. */
export function linkMessage(lines: string[], action: { label: string; path: string }): { text: string; html: string } {
  const url = new URL(action.path, env.APP_URL).toString();
  const text = [...lines, "", `${action.label}: ${url}`, "", "— Lotwarden"].join("\n");
  const html =
    `<div style="font-family:'IBM Plex Sans',Arial,sans-serif;color:#1b2430;max-width:560px">` +
    lines.map((l) => `<p>${escapeHtml(l)}</p>`).join("") +
    `<p><a href="${escapeHtml(url)}" style="background:#2f5d8a;color:#fff;padding:8px 14px;border-radius:4px;text-decoration:none">${escapeHtml(action.label)}</a></p>` +
    `<p style="color:#5b6878;font-size:12px">${escapeHtml(url)}</p></div>`;
  return { text, html };
}
