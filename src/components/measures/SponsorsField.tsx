/** The sponsors of a measure or an amendment: a labelled multiple choice of the chamber's legislators. */
export default function SponsorsField({ id, size, legislators, defaultValue, error, className }: { id: string; size: number; legislators: Array<{ id: string; name: string; bloc: string }>; defaultValue?: string[]; error?: string; className?: string }) {
  return (
    <div className={className}>
      <label htmlFor={id} className="gw-label">Sponsors</label>
      <select id={id} name="sponsors" multiple size={size} className="gw-input" defaultValue={defaultValue} aria-describedby={error ? `${id}-err` : undefined}>
        {legislators.map((l) => <option key={l.id} value={l.id}>{l.name} ({l.bloc})</option>)}
      </select>
      <p className="gw-hint">Ctrl/⌘-click to choose several.</p>
      {error && <p className="gw-error" id={`${id}-err`}>{error}</p>}
    </div>
  );
}
