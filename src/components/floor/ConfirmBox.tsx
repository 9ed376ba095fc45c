import { useEffect, useRef, type ReactNode } from "react";

interface Props {
  /** The question asked, naming the thing ("Record: Amendment A2 to Amendment A1 — rejected, 12–20?"). */
  children: ReactNode;
  yes: string;
  no: string;
  onYes: () => void;
  onNo: () => void;
  busy?: boolean;
  danger?: boolean;
  testId?: string;
}

/** An inline confirmation: the sentence that names what will be recorded, and the two answers. Focus moves to it. */
export default function ConfirmBox({ children, yes, no, onYes, onNo, busy, danger, testId }: Props) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => ref.current?.focus(), []);
  return (
    <div ref={ref} tabIndex={-1} role="group" aria-label="Confirm" className="gw-advisory space-y-2" data-testid={testId}>
      <p className="text-step-0 font-semibold" data-testid={testId ? `${testId}-text` : undefined}>
        {children}
      </p>
      <div className="flex flex-wrap gap-2">
        <button type="button" className={danger ? "gw-btn-danger" : "gw-btn"} disabled={busy} onClick={onYes}>
          {yes}
        </button>
        <button type="button" className="gw-btn-quiet" disabled={busy} onClick={onNo}>
          {no}
        </button>
      </div>
    </div>
  );
}
