/** Addresses in plain text: up to whitespace or a character that cannot end a link in running prose. */
const URL_IN_TEXT = /https?:\/\/[^\s<>"'`]+/g;
const TRAILING_PUNCTUATION = /[.,;:!?)\]}]+$/;

function isWebLink(href: string): boolean {
  try {
    const url = new URL(href);
    return url.protocol === "http:" || url.protocol === "https:";
  } catch {
    return false;
  }
}

/**
 * The web links a message carries (one-time links above all), from its plain-text part and the `href`s of its
 * HTML part, each once and in order of appearance. The HTML is read by DOMParser, which runs no script and
 * loads nothing; only http(s) addresses are kept, so a `javascript:` link can never reach the page.
 */
export function messageLinks(message: { text: string | null; html: string | null }): string[] {
  const found: string[] = [];
  for (const match of message.text?.matchAll(URL_IN_TEXT) ?? []) {
    found.push(match[0].replace(TRAILING_PUNCTUATION, ""));
  }
  if (message.html && typeof DOMParser !== "undefined") {
    const doc = new DOMParser().parseFromString(message.html, "text/html");
    for (const anchor of doc.querySelectorAll("a[href]")) found.push(anchor.getAttribute("href") ?? "");
  }
  return [...new Set(found.filter(isWebLink))];
}

/**
 * The HTML part prepared for a `srcdoc` frame: a Content-Security-Policy that lets it fetch nothing (no remote
 * images, fonts or style sheets that would tell a sender the message was opened; inline styles and data: images
 * only). The frame's empty `sandbox` already keeps scripts, forms and plug-ins off; this closes the network too.
 */
export function isolatedHtml(html: string): string {
  const policy =
    "<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; style-src 'unsafe-inline'; img-src data:\">";
  // Right after <head> (or the doctype): ahead of the doctype the parser would drop it and fall into quirks mode.
  const anchor = /<head(\s[^>]*)?>/i.exec(html) ?? /^\s*<!doctype[^>]*>/i.exec(html);
  if (!anchor) return `${policy}${html}`;
  const at = anchor.index + anchor[0].length;
  return `${html.slice(0, at)}${policy}${html.slice(at)}`;
}
