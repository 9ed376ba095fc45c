/**
 * The islands' one way to tell a person what happened: a refusal or failure (`role="alert"`,
 * read out at once) or a done action (`role="status"`, read out politely).
 *
 * - `tone`: "error" (default) or "ok".
 * - `look`: "text" (default: a line of text, as under a form), "box" (a tinted panel), "inline"
 *   (a span inside a line of controls), "on-dark" (on the chamber-coloured header).
 * - `issues`: the field issues to list under the message, from `listFrom` of them (default 2: the
 *   message already says the first); `showPaths` prints each issue's path (for the rulebook's JSON,
 *   where the path is what the clerk edits); at most `limit` (default 20).
 * - `focus`: the message answers what the person just did (signing in, filing, recording, a step):
 *   it takes the keyboard focus each time it appears or changes, so a screen reader and a
 *   keyboard user land on it (WCAG 2.2, 3.3.1 and 4.1.3; common practice for form results).
 * Keep `testId`s: browser tests select on them.
 */
import { useEffect, useRef, type ReactNode } from "react";
import type { Issue } from "./api.ts";

interface Props {
  children?: ReactNode;
  tone?: "error" | "ok";
  look?: "text" | "box" | "inline" | "on-dark";
  id?: string;
  testId?: string;
  className?: string;
  issues?: readonly Issue[];
  showPaths?: boolean;
  listFrom?: number;
  limit?: number;
  focus?: boolean;
}

const CLASSES: Record<NonNullable<Props["tone"]>, Record<NonNullable<Props["look"]>, string>> = {
  error: {
    text: "gw-error",
    box: "gw-card border-verdict-bar bg-verdict-bar-tint text-sm",
    inline: "gw-error",
    "on-dark": "font-semibold text-brass-tint",
  },
  ok: {
    text: "mt-1 text-sm font-semibold text-verdict-ok",
    box: "gw-card border-verdict-ok bg-verdict-ok-tint text-sm",
    inline: "text-sm font-semibold text-verdict-ok",
    "on-dark": "font-semibold text-white",
  },
};

export function Alert({ children, tone = "error", look = "text", id, testId, className, issues, showPaths = false, listFrom = 2, limit = 20, focus = false }: Props) {
  const ref = useRef<HTMLElement>(null);
  const empty = children === null || children === undefined || children === false || children === "";
  const key = empty ? "" : typeof children === "string" || typeof children === "number" ? String(children) : "shown";
  useEffect(() => {
    if (focus && key) ref.current?.focus();
  }, [focus, key]);
  if (empty) return null;
  const focusable = focus ? { tabIndex: -1, ref: ref as never } : {};
  const role = tone === "error" ? "alert" : "status";
  const cls = [CLASSES[tone][look], className].filter(Boolean).join(" ");
  const list =
    issues && issues.length >= listFrom ? (
      <ul className="list-disc pl-6 text-sm text-verdict-bar">
        {issues.slice(0, limit).map((i, k) => (
          <li key={k}>
            {showPaths && (
              <>
                <code>{i.path}</code>:{" "}
              </>
            )}
            {i.message}
          </li>
        ))}
      </ul>
    ) : null;
  if (look === "inline" || look === "on-dark")
    return (
      <span role={role} id={id} data-testid={testId} className={cls} {...focusable}>
        {children}
      </span>
    );
  if (list || look === "box")
    return (
      <div role={role} id={id} data-testid={testId} className={cls} {...focusable}>
        {children}
        {list}
      </div>
    );
  return (
    <p role={role} id={id} data-testid={testId} className={cls} {...focusable}>
      {children}
    </p>
  );
}

/** The text of an error for a person: an ApiError's (or any Error's) message, else `fallback`. */
export function errorText(e: unknown, fallback: string): string {
  return e instanceof Error && e.message ? e.message : fallback;
}
