import { useId, useState } from 'react';
import { useFieldArray, useFormContext } from 'react-hook-form';
import { scenarioOverrideSchema, type ScenarioOverride, type ScenarioOverrideKind } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { useFieldError } from '@/components/ui/form';
import type { MasterChoices } from '../../api/get-master-choices';
import { blankOverride, overrideKindWords, OverrideFields } from './override-fields';

const kinds = scenarioOverrideSchema.options.map((o) => o.shape.kind.value) as ScenarioOverrideKind[];

/** The list of what-if changes of a scenario: add one of a kind, edit its fields, remove it. */
export function OverridesEditor({ choices, readOnly }: { choices: MasterChoices; readOnly: boolean }) {
  const { control, watch } = useFormContext<{ overrides: ScenarioOverride[] }>();
  const { fields, append, remove } = useFieldArray({ control, name: 'overrides' });
  const [kind, setKind] = useState<ScenarioOverrideKind>('extra_shift');
  const kindId = useId();
  const listError = useFieldError('overrides');
  const overrides = watch('overrides');

  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="text-lg font-semibold">Overrides ({fields.length})</legend>
      {fields.length === 0 ? <p className="text-ink-soft">No overrides yet: a scenario without overrides plans the current data as it is.</p> : null}
      <ol className="flex flex-col gap-3">
        {fields.map((field, index) => {
          const k = overrides?.[index]?.kind ?? (field as ScenarioOverride).kind;
          return (
            <li key={field.id} className="rounded border border-line bg-panel p-3">
              <div className="mb-2 flex items-center justify-between">
                <p className="font-semibold">
                  {index + 1}. {overrideKindWords[k]}
                </p>
                {!readOnly ? (
                  <Button size="sm" variant="quiet" onClick={() => remove(index)} aria-label={`Remove override ${index + 1} (${overrideKindWords[k]})`}>
                    Remove
                  </Button>
                ) : null}
              </div>
              <OverrideFields index={index} kind={k} choices={choices} />
            </li>
          );
        })}
      </ol>
      {listError ? (
        <p className="text-sm text-fault-700">
          <span aria-hidden="true">✕ </span>
          {listError}
        </p>
      ) : null}
      {!readOnly ? (
        <div className="flex items-end gap-2">
          <div className="flex flex-col gap-1">
            <label htmlFor={kindId} className="text-sm font-semibold">
              Kind of override to add
            </label>
            <select id={kindId} value={kind} onChange={(e) => setKind(e.target.value as ScenarioOverrideKind)} className="rounded border border-line bg-panel px-2 py-1.5">
              {kinds.map((k) => (
                <option key={k} value={k}>
                  {overrideKindWords[k]}
                </option>
              ))}
            </select>
          </div>
          <Button
            onClick={() => {
              const last = overrides?.[overrides.length - 1];
              append(blankOverride(kind, { fromWeek: last?.fromWeek ?? '', toWeek: last?.toWeek ?? '' }));
            }}
          >
            Add override
          </Button>
        </div>
      ) : null}
    </fieldset>
  );
}
