import { Field, noIssues, type IssueLookup } from "../shared/fields.tsx";

/** The sponsors of a measure or an amendment: a labelled multiple choice of the chamber's legislators. */
export default function SponsorsField({ id, size, legislators, defaultValue, at = noIssues, className }: { id: string; size: number; legislators: Array<{ id: string; name: string; bloc: string }>; defaultValue?: string[]; at?: IssueLookup; className?: string }) {
  return (
    <Field
      id={id}
      path="sponsors"
      label="Sponsors"
      at={at}
      className={className}
      hint="Ctrl/⌘-click to choose several."
      control={(attrs) => (
        <select {...attrs} name="sponsors" multiple size={size} className="gw-input" defaultValue={defaultValue}>
          {legislators.map((l) => <option key={l.id} value={l.id}>{l.name} ({l.bloc})</option>)}
        </select>
      )}
    />
  );
}
