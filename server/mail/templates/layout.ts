/**
 * One description of a message, rendered twice: as plain text and as simple, inline-styled HTML (mail clients
 * ignore style sheets). Every template builds its blocks once, so both parts always say the same thing.
 */
export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

export type MailBlock =
  | { kind: "paragraph"; text: string }
  | { kind: "action"; label: string; href: string }
  | { kind: "facts"; rows: [label: string, value: string][] }
  | { kind: "quote"; text: string }
  | { kind: "caution"; text: string };

/** The short caution line used wherever a message mentions results. */
export const RESULTS_CAUTION =
  "Results are indicative: critical cases need wind-tunnel verification and review by a licensed engineer " +
  "under the local codes and standards.";

const INK = "#12262b";
const MUTED = "#51727a";
const TIDE = "#14737b";
const CAUTION_BG = "#f6ebc9";
const CAUTION_INK = "#6f520c";

export function escapeHtml(value: string): string {
  return value
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

function htmlBlock(block: MailBlock): string {
  const lines = (text: string) => escapeHtml(text).replace(/\n/g, "<br>");
  switch (block.kind) {
    case "paragraph":
      return `<p style="margin:0 0 14px">${lines(block.text)}</p>`;
    case "action":
      return (
        `<p style="margin:18px 0"><a href="${escapeHtml(block.href)}" style="background:${TIDE};color:#ffffff;` +
        `padding:9px 16px;border-radius:5px;text-decoration:none;font-weight:600">${escapeHtml(block.label)}</a></p>` +
        `<p style="margin:0 0 14px;color:${MUTED};font-size:13px">Or open this address: ` +
        `<a href="${escapeHtml(block.href)}" style="color:${TIDE}">${escapeHtml(block.href)}</a></p>`
      );
    case "facts":
      return (
        `<table role="presentation" style="border-collapse:collapse;margin:0 0 14px">` +
        block.rows
          .map(
            ([label, value]) =>
              `<tr><td style="padding:2px 14px 2px 0;color:${MUTED}">${escapeHtml(label)}</td>` +
              `<td style="padding:2px 0">${escapeHtml(value)}</td></tr>`,
          )
          .join("") +
        `</table>`
      );
    case "quote":
      return (
        `<blockquote style="margin:0 0 14px;padding:6px 12px;border-left:3px solid ${TIDE};white-space:pre-wrap">` +
        `${escapeHtml(block.text)}</blockquote>`
      );
    case "caution":
      return (
        `<p style="margin:14px 0;padding:8px 12px;background:${CAUTION_BG};color:${CAUTION_INK};font-size:13px">` +
        `${lines(block.text)}</p>`
      );
  }
}

function textBlock(block: MailBlock): string {
  switch (block.kind) {
    case "paragraph":
      return block.text;
    case "action":
      return `${block.label}:\n${block.href}`;
    case "facts": {
      const width = Math.max(...block.rows.map(([label]) => label.length));
      return block.rows.map(([label, value]) => `${`${label}:`.padEnd(width + 2)}${value}`).join("\n");
    }
    case "quote":
      return block.text
        .split("\n")
        .map((line) => `> ${line}`)
        .join("\n");
    case "caution":
      return `Caution: ${block.text}`;
  }
}

const FOOTER = "Sent by Stillspan. You receive this because of your role on a Stillspan project.";

export function renderMail(subject: string, greeting: string, blocks: MailBlock[]): RenderedMail {
  const text = `${[greeting, ...blocks.map(textBlock)].join("\n\n")}\n\n-- \n${FOOTER}\n`;
  const html =
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head>` +
    `<body style="margin:0;padding:24px;background:#f5f6f2;font-family:'Source Sans 3','Segoe UI',Arial,sans-serif;` +
    `font-size:15px;line-height:1.45;color:${INK}">` +
    `<div style="max-width:600px;margin:0 auto;background:#fcfcfa;border:1px solid #cfdcdd;border-radius:8px;` +
    `padding:24px">` +
    `<p style="margin:0 0 18px;font-weight:700;letter-spacing:0.04em;color:${TIDE}">STILLSPAN</p>` +
    `<p style="margin:0 0 14px">${escapeHtml(greeting)}</p>` +
    blocks.map(htmlBlock).join("") +
    `<p style="margin:22px 0 0;color:${MUTED};font-size:12px">${escapeHtml(FOOTER)}</p>` +
    `</div></body></html>`;
  return { subject, text, html };
}

/** "1 December 2026, 09:30 UTC": unambiguous for readers in any country. */
export function formatUtc(date: Date): string {
  const day = date.toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });
  const time = date.toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit", timeZone: "UTC" });
  return `${day}, ${time} UTC`;
}

export const greet = (name: string | null | undefined) => (name ? `Hello ${name},` : "Hello,");
