/** A study name as the start of a download's file name: lower-case letters, digits and hyphens, at most 60 characters. */
export function fileSlug(name: string): string {
  return name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 60) || "study";
}
