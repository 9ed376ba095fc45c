import { useState, type SubmitEvent } from "react";
import { authClient } from "../lib/auth-client.ts";
import { safeNext } from "../lib/safe-next.ts";
import { fieldErrors, forgotSchema, resetSchema, signInSchema, signUpSchema, type FieldErrors } from "../lib/account-schemas.ts";
import { Alert } from "./shared/Alert.tsx";
import { issueLookup, TextField } from "./shared/fields.tsx";

type Mode = "sign-in" | "sign-up" | "forgot" | "reset";

interface Props {
  mode: Mode;
  /** Where to go after success (sign-in, sign-up). */
  next?: string;
  token?: string;
  email?: string;
}

const SUBMIT: Record<Mode, string> = { "sign-in": "Sign in", "sign-up": "Create account", forgot: "Send reset link", reset: "Set new password" };

export default function AccountForm({ mode, next = "/", token, email }: Props) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const data = Object.fromEntries(new FormData(e.currentTarget)) as Record<string, string>;
    setMessage(null);
    const schema = { "sign-in": signInSchema, "sign-up": signUpSchema, forgot: forgotSchema, reset: resetSchema }[mode];
    const parsed = schema.safeParse(mode === "reset" ? { ...data, token } : data);
    if (!parsed.success) {
      setErrors(fieldErrors(parsed));
      return;
    }
    setErrors({});
    setBusy(true);
    try {
      if (mode === "sign-in") {
        const r = await authClient.signIn.email({ email: data.email, password: data.password });
        if (r.error)
          return setErrors({
            form:
              r.error.status === 429
                ? r.error.code === "ACCOUNT_LOCKED_FOR_NOW"
                  ? "Too many failed sign-ins for this account. Wait a few minutes, or reset the password, then try again."
                  : "Too many attempts. Wait a minute, then try again."
                : "That e-mail and password do not match an account.",
          });
        window.location.assign(safeNext(next, window.location.origin, "/"));
      } else if (mode === "sign-up") {
        const r = await authClient.signUp.email({ name: data.name, email: data.email, password: data.password });
        if (r.error) {
          const taken = /exist/i.test(r.error.message ?? "") || r.error.code === "USER_ALREADY_EXISTS" || r.error.code === "USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL";
          return setErrors(taken ? { email: "An account with this e-mail already exists. Sign in instead, or reset the password." } : { form: r.error.message ?? "Could not create the account." });
        }
        window.location.assign(safeNext(next, window.location.origin, "/chambers"));
      } else if (mode === "forgot") {
        const r = await authClient.requestPasswordReset({ email: data.email, redirectTo: "/reset-password" });
        if (r.error && r.error.status === 429) return setErrors({ form: "Too many requests. Wait a few minutes, then try again." });
        setMessage("If an account uses that address, a reset link is on its way. It works for one hour.");
      } else {
        const r = await authClient.resetPassword({ newPassword: data.password, token: token! });
        if (r.error) return setErrors({ form: "This reset link has expired or was already used. Ask for a new one." });
        setMessage("Your password is changed. You can sign in now.");
      }
    } finally {
      setBusy(false);
    }
  }

  // A reset token's problem is shown at the new password, the one field of that form.
  const at = issueLookup(Object.entries(errors).map(([path, message]) => ({ path: path === "token" ? "password" : path, message })));
  return (
    <form onSubmit={onSubmit} noValidate className="gw-card space-y-4" aria-describedby={errors.form ? "form-err" : undefined}>
      {mode === "sign-up" && <TextField path="name" name="name" label="Full name" autoComplete="name" at={at} />}
      {mode !== "reset" && <TextField path="email" name="email" label="E-mail" type="email" autoComplete="email" at={at} defaultValue={email} />}
      {(mode === "sign-in" || mode === "sign-up" || mode === "reset") && (
        <TextField
          path="password"
          name="password"
          label={mode === "reset" ? "New password" : "Password"}
          type="password"
          autoComplete={mode === "sign-in" ? "current-password" : "new-password"}
          at={at}
          hint={mode === "sign-in" ? undefined : "At least 10 characters."}
        />
      )}
      <Alert id="form-err" focus>{errors.form}</Alert>
      <Alert tone="ok" look="box" focus>{message}</Alert>
      <button type="submit" className="gw-btn" disabled={busy}>
        {SUBMIT[mode]}
      </button>
    </form>
  );
}
