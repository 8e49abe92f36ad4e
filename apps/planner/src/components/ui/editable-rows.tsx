import type { ReactNode } from 'react';
import { Button } from './button';
import { EmptyState } from './empty-state';

export type EditableRowsColumn = {
  header: ReactNode;
  /** Right-aligned header (quantities and other numbers). */
  numeric?: boolean;
};

/** The part of react-hook-form's `useFieldArray` result the table needs. */
export type EditableRowsArray = {
  fields: { id: string }[];
  remove: (index: number) => void;
  move: (from: number, to: number) => void;
};

/**
 * A table of form rows (a react-hook-form field array) that the user adds to, removes from and,
 * when `onMoved` is given, reorders. The caller owns the field array and renders each row's cells.
 */
export function EditableRows({
  rows,
  caption,
  columns,
  emptyTitle,
  emptyText,
  rowNoun,
  addLabel,
  onAdd,
  onMoved,
  readOnly,
  renderCells,
}: {
  rows: EditableRowsArray;
  /** Read by screen readers as the table's name. */
  caption: string;
  columns: EditableRowsColumn[];
  emptyTitle: string;
  emptyText: ReactNode;
  /** What one row is called in button labels: "Remove {rowNoun} 3". */
  rowNoun: string;
  addLabel: string;
  onAdd: () => void;
  /** Given: each row gets up/down buttons, and this runs after a row has moved. */
  onMoved?: () => void;
  readOnly: boolean;
  /** The row's own cells (`<td>`s), without the actions cell. */
  renderCells: (index: number) => ReactNode;
}) {
  const reorderable = onMoved !== undefined;
  const move = (from: number, to: number) => {
    rows.move(from, to);
    onMoved?.();
  };
  return (
    <div className="flex flex-col gap-3">
      {rows.fields.length === 0 ? (
        <EmptyState title={emptyTitle}>{emptyText}</EmptyState>
      ) : (
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead>
            <tr className="bg-race-50 text-left">
              {columns.map((c, i) => (
                <th key={i} scope="col" className={c.numeric ? 'px-2 py-1.5 text-right' : 'px-2 py-1.5'}>
                  {c.header}
                </th>
              ))}
              {!readOnly ? <th scope="col" className="px-2 py-1.5"><span className="sr-only">Actions</span></th> : null}
            </tr>
          </thead>
          <tbody>
            {rows.fields.map((field, index) => (
              <tr key={field.id} className="border-b border-line/60 align-top">
                {renderCells(index)}
                {!readOnly ? (
                  <td className={reorderable ? 'flex gap-1 px-2 py-1' : 'px-2 py-1'}>
                    {reorderable ? (
                      <>
                        <Button size="sm" disabled={index === 0} onClick={() => move(index, index - 1)} aria-label={`Move ${rowNoun} ${index + 1} up`}>
                          ↑
                        </Button>
                        <Button size="sm" disabled={index === rows.fields.length - 1} onClick={() => move(index, index + 1)} aria-label={`Move ${rowNoun} ${index + 1} down`}>
                          ↓
                        </Button>
                      </>
                    ) : null}
                    <Button size="sm" variant="danger" onClick={() => rows.remove(index)} aria-label={`Remove ${rowNoun} ${index + 1}`}>
                      Remove
                    </Button>
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {!readOnly ? (
        <div>
          <Button size="sm" onClick={onAdd}>
            {addLabel}
          </Button>
        </div>
      ) : null}
    </div>
  );
}
