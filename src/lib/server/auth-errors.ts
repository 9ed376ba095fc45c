/** Translate better-auth's API errors into the app's error catalogue. */
import { GavelError } from "../errors.ts";

interface AuthApiError {
  status?: string | number;
  statusCode?: number;
  body?: { code?: string; message?: string };
  message?: string;
}

const CONFLICT = /ALREADY/;
const FORBIDDEN = /NOT_ALLOWED|FORBIDDEN/;
const NOT_FOUND = /NOT_FOUND/;

export function fromAuthError(e: unknown): GavelError {
  if (e instanceof GavelError) return e;
  const err = e as AuthApiError;
  const code = err?.body?.code ?? "";
  const message = err?.body?.message ?? err?.message ?? "The request was refused.";
  if (CONFLICT.test(code)) return new GavelError("conflict", message, { details: { authCode: code } });
  if (FORBIDDEN.test(code)) return new GavelError("forbidden", message, { details: { authCode: code } });
  if (NOT_FOUND.test(code)) return new GavelError("not-found", message, { details: { authCode: code } });
  if (err?.statusCode === 401) return new GavelError("unauthenticated", message);
  if (err?.statusCode === 400 || err?.statusCode === 422) return new GavelError("invalid-input", message, { details: { authCode: code } });
  throw e;
}
