/** The header row of the rental and billing pages' small tables; a column ending in "#" is a number, set right (the "#" is not shown). */
export function TableHead({ columns }: { columns: string[] }) {
  return (
    <thead className="border-b border-paper-line text-ink-700">
      <tr>
        {columns.map((c) => (
          <th key={c} scope="col" className={`py-1 pr-2 font-semibold ${c.endsWith('#') ? 'text-right' : ''}`}>
            {c.replace(/#$/, '')}
          </th>
        ))}
      </tr>
    </thead>
  );
}
