import { useState } from 'react';
import type { Person } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import type { WorkCenterChoice } from '../api/get-work-center-choices';

export type WorkCenterPickerProps = {
  person: Person;
  /** every work center of the plant, by code; undefined while loading */
  choices: WorkCenterChoice[] | undefined;
  /** why the choices could not be loaded, if they could not */
  choicesError?: string;
  busy: boolean;
  onSave: (workCenterIds: number[]) => void;
};

/** The assigned work centers in words: codes in the plant's order, or what having none means. */
export function assignedWorkCentersText(ids: readonly number[], choices: readonly WorkCenterChoice[] | undefined): string {
  if (ids.length === 0) return 'None: sees all';
  if (!choices) return `${ids.length} assigned`;
  return choices
    .filter((c) => ids.includes(c.id))
    .map((c) => c.code)
    .join(', ');
}

/**
 * The work centers of one floor lead, chosen with a check box each: they then see only those
 * work centers' shift sheets and their release e-mail names them. None ticked means every work
 * center. Saving sends the whole list with the version the page read.
 */
export function WorkCenterPicker({ person, choices, choicesError, busy, onSave }: WorkCenterPickerProps) {
  const saved = person.workCenterIds ?? [];
  const [picked, setPicked] = useState<number[]>(saved);
  const [open, setOpen] = useState(false);
  const changed = picked.length !== saved.length || picked.some((id) => !saved.includes(id));
  const toggle = (id: number, on: boolean) => setPicked((now) => (on ? [...now, id] : now.filter((x) => x !== id)));

  return (
    <details open={open} onToggle={(e) => setOpen(e.currentTarget.open)} className="text-sm">
      <summary className="cursor-pointer" aria-label={`Work centers of ${person.name}: ${assignedWorkCentersText(saved, choices)}`}>
        {assignedWorkCentersText(saved, choices)}
      </summary>
      {open ? (
        <fieldset className="mt-1 flex max-w-xs flex-col gap-1 rounded border border-line bg-panel p-2">
          <legend className="px-1 font-semibold">Work centers of {person.name}</legend>
          <p className="text-ink-soft">Tick none to let them see every work center.</p>
          {choicesError ? <p role="alert">The work centers could not be loaded: {choicesError}</p> : null}
          {!choices && !choicesError ? <p>Loading work centers…</p> : null}
          {choices?.length === 0 ? <p>The plant has no work centers yet.</p> : null}
          {choices?.map((c) => (
            <label key={c.id} className="flex items-center gap-2">
              <input type="checkbox" checked={picked.includes(c.id)} disabled={busy} onChange={(e) => toggle(c.id, e.target.checked)} />
              {c.code} {c.name}
            </label>
          ))}
          <div className="mt-1 flex gap-2">
            <Button size="sm" variant="primary" busy={busy} busyLabel="Saving…" disabled={!changed || !choices} onClick={() => onSave(choices ? choices.filter((c) => picked.includes(c.id)).map((c) => c.id) : picked)}>
              Save work centers
            </Button>
            <Button size="sm" variant="quiet" disabled={!changed || busy} onClick={() => setPicked(saved)}>
              Undo
            </Button>
          </div>
        </fieldset>
      ) : null}
    </details>
  );
}
