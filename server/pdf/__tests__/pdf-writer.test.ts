import path from "node:path";
import PDFDocument from "pdfkit";
import pdfParse from "pdf-parse/lib/pdf-parse.js";
import { describe, expect, it } from "vitest";
import { projectRoot } from "../../config";
import { FONTS, PdfWriter } from "../pdf-writer";

const FONT_DIR = path.join(projectRoot, "server", "assets", "fonts");

/** Renders with `draw`, then reads the text of each page back with an independent extractor (pdf-parse). */
async function pagesOf(draw: (w: PdfWriter) => void): Promise<string[]> {
  const doc = new PDFDocument({ size: "A4", margins: { top: 48, bottom: 56, left: 48, right: 48 } });
  doc.registerFont(FONTS.regular, path.join(FONT_DIR, "DejaVuSans.ttf"));
  const chunks: Buffer[] = [];
  doc.on("data", (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve) => doc.on("end", () => resolve(Buffer.concat(chunks))));
  draw(new PdfWriter(doc));
  doc.end();
  const pdf = await done;
  const pages: string[] = [];
  const options = {
    pagerender: async (page: { getTextContent: () => Promise<{ items: { str: string }[] }> }) => {
      const content = await page.getTextContent();
      pages.push(content.items.map((item) => item.str).join(" "));
      return "";
    },
  };
  await (pdfParse as unknown as (data: Buffer, o: typeof options) => Promise<unknown>)(pdf, options);
  return pages;
}

describe("PdfWriter.bullet", () => {
  it("keeps a bullet on the page of its text when the text would not fit below it", async () => {
    const text = "A bullet's text long enough to need three lines. ".repeat(6).trim();
    const pages = await pagesOf((w) => {
      // Leave room for one line only: the bullet glyph would fit, its three lines would not.
      w.y = w.doc.page.height - w.doc.page.margins.bottom - 14;
      w.bullet(text);
    });
    expect(pages).toHaveLength(2);
    expect(pages[0]).not.toContain("•");
    expect(pages[1]).toContain("•");
    expect(pages[1]).toContain("A bullet's text");
  });
});
