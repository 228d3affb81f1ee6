/**
 * How a basis or source text says it was checked (shared/criteria/sources.ts words them): the UI marks
 * "from memory" and "common practice" beside the value so nobody takes a recalled clause for a verified one.
 */
export type SourceStatus = "from-memory" | "common-practice" | "secondary" | null;

export function sourceStatus(text: string): SourceStatus {
  if (/from memory/i.test(text)) return "from-memory";
  if (/common practice/i.test(text)) return "common-practice";
  if (/secondary source/i.test(text)) return "secondary";
  return null;
}

export const SOURCE_STATUS_LABEL: Record<Exclude<SourceStatus, null>, string> = {
  "from-memory": "from memory",
  "common-practice": "common practice",
  secondary: "secondary source",
};
