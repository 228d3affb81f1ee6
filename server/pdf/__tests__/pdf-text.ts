import pdfParse from "pdf-parse/lib/pdf-parse.js";

/** Text and page count of a PDF, read by an independent extractor (pdf-parse, built on Mozilla's pdf.js). */
export async function pdfText(pdf: Buffer): Promise<{ text: string; pages: number; info: Record<string, unknown> }> {
  const parsed = await pdfParse(pdf);
  return { text: parsed.text, pages: parsed.numpages, info: parsed.info };
}
