/**
 * A table's column headings, each a column header for screen readers. `actions` adds a last column
 * for the rows' buttons, named "Actions" for screen readers only. A heading given as `false` is left
 * out (a column the viewer may not see).
 */
export function TableHead({ columns, actions = false }: { columns: ReadonlyArray<string | false>; actions?: boolean }) {
  return (
    <thead>
      <tr>
        {columns.map((c) =>
          c === false ? null : (
            <th key={c} scope="col">
              {c}
            </th>
          ),
        )}
        {actions && (
          <th scope="col">
            <span className="sr-only">Actions</span>
          </th>
        )}
      </tr>
    </thead>
  );
}
