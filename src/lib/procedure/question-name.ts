/**
 * How the clerk reads a pending question in forms, confirmations and the record: "Amendment A2
 * to Amendment A1 — “Insert …”", "Main motion M1 — “That the Assembly …”". One naming for the
 * server's history lines and the floor page. Pure.
 */
export interface NamedQuestion {
  motion: string;
  name: string;
  /** An amendment's degree; null for any other motion. */
  degree: number | null;
  text: string;
  /** The clerk's short reference ("A2"), empty when none was given. */
  ref: string;
}

const clip = (text: string, max = 80) => (text.length > max ? `${text.slice(0, max - 1).trimEnd()}…` : text);

/** How a question is referred to inside another's name, or on a button: its reference, or what it is. */
export function shortQuestionName(item: NamedQuestion): string {
  if (item.degree !== null) return item.ref ? `Amendment ${item.ref}` : "the amendment";
  if (item.ref) return `${item.name} ${item.ref}`;
  return item.motion === "main" ? "the main motion" : `“${item.name}”`;
}

/** The full name of the question at `index` of the stack (bottom first). */
export function questionName(pending: readonly NamedQuestion[], index: number): string {
  const item = pending[index];
  if (!item) return "";
  const wording = item.text ? ` — “${clip(item.text)}”` : "";
  if (item.degree !== null) {
    const target = pending[index - 1];
    const own = item.ref ? `Amendment ${item.ref}` : item.degree > 1 ? `An amendment of degree ${item.degree}` : "An amendment";
    return `${own}${target ? ` to ${shortQuestionName(target)}` : ""}${wording}`;
  }
  return `${item.name}${item.ref ? ` ${item.ref}` : ""}${wording}`;
}
