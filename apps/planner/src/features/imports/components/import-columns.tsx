import { importFields, type ImportFieldDef, type ImportKind } from '@millrace/contracts';
import { importKindLabels } from './import-kinds';

function need(field: ImportFieldDef): string {
  if (field.required) return 'Required';
  if (field.requiredToCreate) return 'Required for new records';
  return 'Optional';
}

/**
 * The columns an import of one kind reads: each field with the header our exports write and the
 * other headers taken to mean it (from the shared import contract), in a collapsible panel.
 */
export function ImportColumns({ kind }: { kind: ImportKind }) {
  const fields = importFields[kind];
  return (
    <details className="mb-4 rounded border border-line bg-panel p-3 text-sm">
      <summary className="cursor-pointer font-semibold">Columns we read</summary>
      <p className="mt-2 text-ink-soft">
        Headers are matched without regard to case, spaces or punctuation; columns not listed are left alone. You can still choose the
        column of each field after checking the file.
      </p>
      <table className="mt-2 w-full border-collapse" aria-label={`Columns read from a ${importKindLabels[kind].toLowerCase()} file`}>
        <thead>
          <tr className="text-left">
            <th scope="col" className="border border-line px-2 py-1">Header</th>
            <th scope="col" className="border border-line px-2 py-1">Needed</th>
            <th scope="col" className="border border-line px-2 py-1">Also accepted</th>
            <th scope="col" className="border border-line px-2 py-1">Values</th>
          </tr>
        </thead>
        <tbody>
          {fields.map((field) => (
            <tr key={field.key}>
              <th scope="row" className="border border-line px-2 py-1 text-left font-semibold">{field.label}</th>
              <td className="border border-line px-2 py-1">{need(field)}</td>
              <td className="border border-line px-2 py-1">{field.synonyms.join(', ')}</td>
              <td className="border border-line px-2 py-1">{field.choices ? `one of ${field.choices.join(', ')}` : field.type}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </details>
  );
}
