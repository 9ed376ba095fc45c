import { useState } from "react";
import { z } from "zod";
import { apiCall } from "../shared/api.ts";
import { errorText } from "../shared/Alert.tsx";
import { ConfirmDialog } from "../shared/ConfirmDialog.tsx";

interface Props {
  measureId: string;
  /** "HCA 12 — Harbour Lighting Ordinance", as the dialog names it. */
  name: string;
  version: number;
}

/** A clerk archives a measure after a confirmation that names it; the page then reloads read-only. */
export default function ArchiveMeasure({ measureId, name, version }: Props) {
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function archive() {
    setBusy(true);
    setError(null);
    try {
      await apiCall(z.object({ archivedAt: z.string().nullable() }), `/api/measures/${measureId}/archive`, { method: "POST", body: { version } });
      window.location.reload();
    } catch (e) {
      setError(errorText(e, "The measure was not archived."));
      setBusy(false);
    }
  }

  return (
    <>
      <button type="button" className="gw-btn-quiet" onClick={() => setOpen(true)}>
        Archive this measure…
      </button>
      <ConfirmDialog open={open} testId="archive-confirm" title={`Archive ${name}?`} confirm="Archive it" busy={busy} error={error} onConfirm={() => void archive()} onCancel={() => setOpen(false)}>
        <p>The measure leaves the list of measures and the forms that offer measures. It stays readable from its own page and from the archived measures, with its amendments and history.</p>
        <p>This cannot be undone: an archived measure and its amendments take no more changes.</p>
      </ConfirmDialog>
    </>
  );
}
