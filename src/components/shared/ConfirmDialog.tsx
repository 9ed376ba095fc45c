/**
 * The one confirmation before something final (issuing a ruling, withdrawing an amendment, changing
 * a role, removing a person, archiving a measure): a modal dialog whose title names the thing and whose
 * text says what follows and whether it can be undone. Opening it moves the focus into it (to the
 * answer that changes nothing); Escape or "Cancel" closes it and gives the focus back.
 */
import { useEffect, useId, useRef, type ReactNode } from "react";
import { Alert } from "./Alert.tsx";

interface Props {
  open: boolean;
  /** Names what will happen to what: "Withdraw Amendment A3 to section 2 of HCA 12?" */
  title: string;
  /** What follows, and whether it can be undone. */
  children: ReactNode;
  /** The button that does it ("Withdraw it"). */
  confirm: string;
  cancel?: string;
  onConfirm: () => void;
  onCancel: () => void;
  busy?: boolean;
  danger?: boolean;
  /** A refusal from the server, shown inside the dialog. */
  error?: string | null;
  testId?: string;
}

export function ConfirmDialog({ open, title, children, confirm, cancel = "Cancel", onConfirm, onCancel, busy, danger = true, error, testId }: Props) {
  const ref = useRef<HTMLDialogElement>(null);
  const stay = useRef<HTMLButtonElement>(null);
  const id = useId();
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) {
      d.showModal();
      stay.current?.focus();
    } else if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby={`${id}-t`}
      aria-describedby={`${id}-d`}
      data-testid={testId}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-md border border-rule bg-white p-5 text-ink shadow-lg backdrop:bg-ink/40"
      onCancel={(e) => {
        e.preventDefault();
        if (!busy) onCancel();
      }}
    >
      <h2 id={`${id}-t`} className="text-step-1 font-semibold">
        {title}
      </h2>
      <div id={`${id}-d`} className="mt-2 space-y-2 text-sm">
        {children}
      </div>
      <Alert look="box" className="mt-3">{error}</Alert>
      <div className="mt-4 flex flex-wrap justify-end gap-2">
        <button ref={stay} type="button" className="gw-btn-quiet" disabled={busy} onClick={onCancel}>
          {cancel}
        </button>
        <button type="button" className={danger ? "gw-btn-danger" : "gw-btn"} disabled={busy} onClick={onConfirm}>
          {confirm}
        </button>
      </div>
    </dialog>
  );
}
