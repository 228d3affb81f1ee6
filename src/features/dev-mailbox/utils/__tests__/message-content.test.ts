import { describe, expect, it } from "vitest";
import { isolatedHtml, messageLinks } from "@/features/dev-mailbox/utils/message-content";

const POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:";

describe("messageLinks", () => {
  it("lists each web link of the text and HTML parts once, in order, without trailing punctuation", () => {
    const links = messageLinks({
      text: "Set your password: https://app.example/accept-invite?token=abc.\nHelp (https://app.example/help).",
      html: '<p><a href="https://app.example/accept-invite?token=abc">Set</a> <a href="https://app.example/other">x</a></p>',
    });
    expect(links).toEqual([
      "https://app.example/accept-invite?token=abc",
      "https://app.example/help",
      "https://app.example/other",
    ]);
  });

  it("keeps no javascript:, data: or mailto: address out of the HTML part", () => {
    const links = messageLinks({
      text: null,
      html: '<a href="javascript:alert(1)">a</a><a href="data:text/html,x">b</a><a href="mailto:a@b.c">c</a>',
    });
    expect(links).toEqual([]);
  });
});

describe("isolatedHtml", () => {
  it("puts the no-fetch policy first in the head, keeping the doctype in front", () => {
    const out = isolatedHtml('<!doctype html><html lang="en"><head><meta charset="utf-8"></head><body>x</body></html>');
    expect(out.startsWith('<!doctype html><html lang="en"><head><meta http-equiv="Content-Security-Policy"')).toBe(true);
    const doc = new DOMParser().parseFromString(out, "text/html");
    expect(doc.head.querySelector('meta[http-equiv="Content-Security-Policy"]')?.getAttribute("content")).toBe(POLICY);
    expect(doc.body.textContent).toBe("x");
  });

  it("adds the policy after the doctype when the HTML has no head, and in front of a bare fragment", () => {
    expect(isolatedHtml("<!DOCTYPE html><p>x</p>")).toMatch(/^<!DOCTYPE html><meta http-equiv="Content-Security-Policy"/);
    expect(isolatedHtml("<p>x</p>")).toMatch(/^<meta http-equiv="Content-Security-Policy"[^>]*><p>x<\/p>$/);
  });
});
