/**
 * Ask the API whenever the request changes, and keep only the answer to the latest request: an
 * answer to an earlier one arriving late (the clerk changed the measure, the versions compared,
 * the pending motions) is dropped, so the page never shows the answer to a question it no longer
 * asks. `request` null: nothing is asked. The handlers are the island's own (set state, reset a
 * preview); the latest ones are called.
 */
import { useEffect, useRef } from "react";
import type { z } from "zod";
import { apiCall } from "./api.ts";

/** A JSON request: a GET by default, or `method` with `body` sent as JSON. */
export interface JsonRequest {
  url: string;
  method?: string;
  body?: unknown;
}

export function useLatestAnswer<S extends z.ZodType>(schema: S, request: JsonRequest | null, onAnswer: (answer: z.output<S>) => void, onError: (error: unknown) => void): void {
  const handlers = useRef({ onAnswer, onError });
  handlers.current = { onAnswer, onError };
  // The request by value: a new object with the same URL and body asks nothing again.
  const key = request ? JSON.stringify(request) : null;
  useEffect(() => {
    if (!key) return;
    const { url, ...init } = JSON.parse(key) as JsonRequest;
    let stale = false;
    apiCall(schema, url, init).then(
      (answer) => {
        if (!stale) handlers.current.onAnswer(answer);
      },
      (error: unknown) => {
        if (!stale) handlers.current.onError(error);
      },
    );
    return () => {
      stale = true;
    };
  }, [key, schema]);
}
