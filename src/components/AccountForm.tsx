import { useState, type FormEvent } from "react";
import { authClient } from "../lib/auth-client.ts";
import { safeNext } from "../lib/safe-next.ts";
import { fieldErrors, forgotSchema, resetSchema, signInSchema, signUpSchema, type FieldErrors } from "../lib/account-schemas.ts";

type Mode = "sign-in" | "sign-up" | "forgot" | "reset";

interface Props {
  mode: Mode;
  /** Where to go after success (sign-in, sign-up). */
  next?: string;
  token?: string;
  email?: string;
}

const SUBMIT: Record<Mode, string> = { "sign-in": "Sign in", "sign-up": "Create account", forgot: "Send reset link", reset: "Set new password" };

function Field(props: { name: string; label: string; type?: string; autoComplete?: string; error?: string; defaultValue?: string; hint?: string }) {
  const id = `f-${props.name}`;
  return (
    <div>
      <label htmlFor={id} className="gw-label">
        {props.label}
      </label>
      <input
        id={id}
        name={props.name}
        type={props.type ?? "text"}
        autoComplete={props.autoComplete}
        defaultValue={props.defaultValue}
        aria-invalid={props.error ? true : undefined}
        aria-describedby={props.error ? `${id}-err` : props.hint ? `${id}-hint` : undefined}
        className="gw-input"
      />
      {props.hint && !props.error && (
        <p id={`${id}-hint`} className="gw-hint">
          {props.hint}
        </p>
      )}
      {props.error && (
        <p id={`${id}-err`} className="gw-error">
          {props.error}
        </p>
      )}
    </div>
  );
}

export default function AccountForm({ mode, next = "/", token, email }: Props) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
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

  return (
    <form onSubmit={onSubmit} noValidate className="gw-card space-y-4" aria-describedby={errors.form ? "form-err" : undefined}>
      {mode === "sign-up" && <Field name="name" label="Full name" autoComplete="name" error={errors.name} />}
      {mode !== "reset" && <Field name="email" label="E-mail" type="email" autoComplete="email" error={errors.email} defaultValue={email} />}
      {(mode === "sign-in" || mode === "sign-up" || mode === "reset") && (
        <Field
          name="password"
          label={mode === "reset" ? "New password" : "Password"}
          type="password"
          autoComplete={mode === "sign-in" ? "current-password" : "new-password"}
          error={errors.password ?? errors.token}
          hint={mode === "sign-in" ? undefined : "At least 10 characters."}
        />
      )}
      {errors.form && (
        <p id="form-err" role="alert" className="gw-error">
          {errors.form}
        </p>
      )}
      {message && (
        <p role="status" className="rounded-md bg-verdict-ok-tint px-3 py-2 text-sm font-semibold text-verdict-ok">
          {message}
        </p>
      )}
      <button type="submit" className="gw-btn" disabled={busy}>
        {SUBMIT[mode]}
      </button>
    </form>
  );
}
