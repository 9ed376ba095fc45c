/** Comma-separated subject tags as the API takes them: trimmed, empty ones dropped. */
export const tags = (s: string): string[] =>
  s
    .split(",")
    .map((t) => t.trim())
    .filter(Boolean);
