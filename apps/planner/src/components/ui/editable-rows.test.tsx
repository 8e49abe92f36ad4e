import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { FormProvider, useFieldArray, useForm } from 'react-hook-form';
import { describe, expect, it, vi } from 'vitest';
import { EditableRows } from './editable-rows';

type Values = { items: { name: string }[] };

function Harness({ readOnly = false, onMoved }: { readOnly?: boolean; onMoved?: () => void }) {
  const form = useForm<Values>({ defaultValues: { items: [{ name: 'first' }, { name: 'second' }] } });
  const rows = useFieldArray({ control: form.control, name: 'items' });
  return (
    <FormProvider {...form}>
      <EditableRows
        rows={rows}
        caption="Test items"
        columns={[{ header: 'Name' }, { header: 'Quantity', numeric: true }]}
        emptyTitle="No items"
        emptyText="Add one."
        rowNoun="item"
        addLabel="Add item"
        onAdd={() => rows.append({ name: 'new' })}
        onMoved={onMoved}
        readOnly={readOnly}
        renderCells={(index) => (
          <>
            <td>
              <input aria-label={`Name, item ${index + 1}`} {...form.register(`items.${index}.name`)} />
            </td>
            <td />
          </>
        )}
      />
    </FormProvider>
  );
}

const names = () => screen.getAllByRole('textbox').map((t) => (t as HTMLInputElement).value);

describe('editable rows', () => {
  it('when rows are added and removed, then the table follows and shows the empty state at the end', async () => {
    render(<Harness />);
    const user = userEvent.setup();
    expect(within(screen.getByRole('table', { name: 'Test items' })).getByRole('columnheader', { name: 'Quantity' })).toHaveClass('text-right');
    await user.click(screen.getByRole('button', { name: 'Add item' }));
    expect(names()).toEqual(['first', 'second', 'new']);
    await user.click(screen.getByRole('button', { name: 'Remove item 1' }));
    expect(names()).toEqual(['second', 'new']);
    await user.click(screen.getByRole('button', { name: 'Remove item 2' }));
    await user.click(screen.getByRole('button', { name: 'Remove item 1' }));
    expect(screen.queryByRole('table')).toBeNull();
    expect(screen.getByText('No items')).toBeInTheDocument();
  });

  it('when onMoved is given, then rows move up and down, the ends are disabled, and onMoved runs after each move', async () => {
    const onMoved = vi.fn();
    render(<Harness onMoved={onMoved} />);
    const user = userEvent.setup();
    expect(screen.getByRole('button', { name: 'Move item 1 up' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Move item 2 down' })).toBeDisabled();
    await user.click(screen.getByRole('button', { name: 'Move item 2 up' }));
    expect(names()).toEqual(['second', 'first']);
    expect(onMoved).toHaveBeenCalledTimes(1);
  });

  it('when onMoved is not given or the table is read-only, then there are no move buttons or no actions at all', () => {
    const { unmount } = render(<Harness />);
    expect(screen.queryByRole('button', { name: /^Move item/ })).toBeNull();
    expect(screen.getByRole('button', { name: 'Remove item 1' })).toBeInTheDocument();
    unmount();
    render(<Harness readOnly onMoved={() => undefined} />);
    expect(screen.queryByRole('button')).toBeNull();
    expect(screen.getAllByRole('columnheader')).toHaveLength(2);
  });
});
