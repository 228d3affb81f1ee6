import { IMAGE_TYPES } from "../../shared/schemas/alternatives.js";

export type ImageType = (typeof IMAGE_TYPES)[number];

const PNG = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const JPEG = [0xff, 0xd8, 0xff];

const startsWith = (bytes: Uint8Array, magic: number[]) => magic.every((b, i) => bytes[i] === b);

/**
 * The image type of `bytes` by its magic bytes, checked against the declared content type.
 * SVG has no magic number: it must be UTF-8 text starting (after an optional BOM, XML declaration, comments or
 * doctype) with an `<svg` element, and it may not carry scripts or embedded HTML — SVG is also served with a
 * sandboxing Content-Security-Policy, so this is defence in depth.
 * @returns the type, or a sentence saying what is wrong
 */
export function checkImage(bytes: Uint8Array, declared: string): { ok: true; type: ImageType } | { ok: false; message: string } {
  const contentType = declared === "image/jpg" ? "image/jpeg" : declared;
  if (!(IMAGE_TYPES as readonly string[]).includes(contentType)) {
    return { ok: false, message: `The content type ${declared || "(none)"} is not accepted: send a PNG, JPEG or SVG image.` };
  }
  const detected = detect(bytes);
  if (detected === null) {
    return { ok: false, message: `The file is not a PNG, JPEG or SVG image (its first bytes match none of them).` };
  }
  if (detected !== contentType) {
    return { ok: false, message: `The file was sent as ${contentType} but its content is ${detected}.` };
  }
  if (detected === "image/svg+xml") {
    const text = new TextDecoder().decode(bytes);
    if (/<script\b|<foreignObject\b|\bjavascript:/i.test(text)) {
      return { ok: false, message: "The SVG contains scripts or embedded HTML, which are not accepted." };
    }
  }
  return { ok: true, type: detected };
}

function detect(bytes: Uint8Array): ImageType | null {
  if (startsWith(bytes, PNG)) return "image/png";
  if (startsWith(bytes, JPEG)) return "image/jpeg";
  let text: string;
  try {
    // stream: a multi-byte sequence cut at the end of the prefix is not an error of the file.
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes.subarray(0, 4096), { stream: true }).replace(/^\uFEFF/, "");
  } catch {
    return null;
  }
  const prologue = text.replace(/^(\s|<\?xml[\s\S]*?\?>|<!--[\s\S]*?-->|<!DOCTYPE[^>]*>)*/i, "");
  return /^<svg[\s>]/i.test(prologue) ? "image/svg+xml" : null;
}
