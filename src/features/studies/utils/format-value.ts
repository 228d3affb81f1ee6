/** A JSON value from a study document as a short readable text (numbers without float noise, arrays compact). */
export function formatValue(value: unknown): string {
  if (value === undefined) return "—";
  if (typeof value === "number") return String(Number(value.toPrecision(8)));
  if (typeof value === "string") return value;
  if (Array.isArray(value)) {
    const items = value.map((v) => formatValue(v));
    return items.length > 8 ? `[${items.slice(0, 8).join(", ")}, … ${items.length} values]` : `[${items.join(", ")}]`;
  }
  return JSON.stringify(value);
}

export { fieldLabel } from "@shared/study-field-label";
