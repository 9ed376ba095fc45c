/**
 * Field issues in a person's words. The API answers an invalid input with issues naming each
 * field by its path ("citations.0.ruleId") and a message written for the API and the CLI; a
 * screen shows the field in words ("Citations, item 1: rule") and the message without developer
 * terms ("choose one from the list" rather than "must be an id (uuid)"). Pure: no I/O.
 */
export interface FieldIssue {
  path: string;
  message: string;
}

/** A field's path in words: "raisedById" → "Raised by", "citations.0.ruleId" → "Citations, item 1: rule". */
export function fieldWords(path: string): string {
  const parts = path.split(".").filter((p) => p && p !== "(root)");
  const words = parts.map((p) =>
    /^\d+$/.test(p)
      ? `item ${Number(p) + 1}`
      : p
          .replace(/Ids$/, "s")
          .replace(/Id$/, "")
          .replace(/([a-z0-9])([A-Z])/g, "$1 $2")
          .replace(/[-_]+/g, " ")
          .toLowerCase()
          .trim(),
  );
  const text = words.reduce((acc, w, i) => (i === 0 ? w : /^item \d+$/.test(w) ? `${acc}, ${w}` : `${acc}${/^item \d+$/.test(words[i - 1]) ? ":" : ","} ${w}`), "");
  return text ? text[0].toUpperCase() + text.slice(1) : "The form";
}

const PLAIN: Array<[RegExp, string]> = [
  [/must be an id \(uuid\)|^invalid uuid$/i, "choose one from the list"],
  [/must be a version id/i, "choose a rulebook version from the list"],
  [/^invalid input: expected \w+, received (undefined|null)$/i, "this is required"],
  [/^invalid input: expected (\w+), received \w+$/i, "this value is of the wrong kind"],
  [/^invalid (iso )?datetime$/i, "enter a date and time"],
  [/^invalid (iso )?date$/i, "enter a date"],
];

/** An issue's message without developer terms (others are kept as written). */
export function issueWords(message: string): string {
  for (const [re, words] of PLAIN) if (re.test(message)) return words;
  return message;
}

/** The one-line summary of an invalid input: the first field in words, and how many more need attention. */
export function invalidInputWords(issues: readonly FieldIssue[]): string {
  const [first] = issues;
  if (!first) return "Something entered is not valid.";
  const more = issues.length > 1 ? ` (${issues.length - 1} more ${issues.length === 2 ? "field needs" : "fields need"} attention)` : "";
  return `${fieldWords(first.path)}: ${issueWords(first.message)}${more}.`;
}
