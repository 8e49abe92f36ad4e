import { zodResolver } from '@hookform/resolvers/zod';
import { createContext, useContext, useEffect, useState, type ReactNode } from 'react';
import {
  FormProvider,
  get,
  useForm,
  useFormContext,
  type DefaultValues,
  type FieldValues,
  type Path,
  type UseFormReturn,
} from 'react-hook-form';
import type { z } from 'zod';
import { isApiError } from '@/lib/api-client';
import { Button } from './button';
import { Checkbox, Input, Select, type SelectOption } from './field';

/** Plain messages for the checks the browser form cannot phrase itself. */
const formErrorMap = (issue: { code: string; expected?: unknown; input?: unknown }) => {
  if (issue.code === 'invalid_type' && issue.expected === 'number') return 'Enter a number.';
  if (issue.code === 'invalid_type' && issue.input === undefined) return 'This is required.';
  return undefined;
};

/** Names of the fields drawn on screen, so server errors can tell "on a field" from "elsewhere". */
const FieldRegistry = createContext<Set<string> | null>(null);

export function useRegisteredName(name: string) {
  const registry = useContext(FieldRegistry);
  useEffect(() => {
    registry?.add(name);
    return () => {
      registry?.delete(name);
    };
  }, [registry, name]);
}

/** 'lines.3.qty' → 'lines, row 4, qty' for messages that have no field on screen. */
export function humanPath(path: string): string {
  return path
    .split('.')
    .map((part) => (/^\d+$/.test(part) ? `row ${Number(part) + 1}` : part))
    .join(', ');
}

/** "item: message", unless the message already starts by naming its item */
function withItem(path: string, message: string): string {
  if (!path) return message;
  const item = humanPath(path);
  return message.startsWith(`${item}:`) ? message : `${item}: ${message}`;
}

type Outcome =
  | { kind: 'idle' }
  | { kind: 'saved'; message: string }
  | { kind: 'conflict'; message: string }
  | { kind: 'failed'; message: string; unplaced: { path: string; message: string }[] };

export type FormProps<S extends z.ZodType<FieldValues, FieldValues>> = {
  schema: S;
  defaultValues: DefaultValues<z.input<S>>;
  /** Saves; may return the values to show afterwards (e.g. with the new version). Throw ApiError to report. */
  onSubmit: (values: z.output<S>) => Promise<z.input<S> | void>;
  /** Fetches the record again after a 409 and returns the values to show. */
  onReload?: () => Promise<z.input<S>>;
  /** Read-only: every control disabled and no save button. */
  readOnly?: boolean;
  submitLabel: string;
  savedMessage?: string;
  /** Accessible name of the form. */
  label: string;
  children: ReactNode | ((form: UseFormReturn<z.input<S>, unknown, z.output<S>>) => ReactNode);
  className?: string;
};

/**
 * The one form of the planner: react-hook-form with the contract's zod schema, server field errors
 * (400/422 with paths) placed on their fields, a 409 banner with Reload, read-only mode.
 */
export function Form<S extends z.ZodType<FieldValues, FieldValues>>({
  schema,
  defaultValues,
  onSubmit,
  onReload,
  readOnly = false,
  submitLabel,
  savedMessage = 'Saved.',
  label,
  children,
  className = '',
}: FormProps<S>) {
  const form = useForm<z.input<S>, unknown, z.output<S>>({
    resolver: zodResolver(schema as never, { error: formErrorMap } as never) as never,
    defaultValues,
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
  const [registry] = useState(() => new Set<string>());
  const [outcome, setOutcome] = useState<Outcome>({ kind: 'idle' });
  const [reloading, setReloading] = useState(false);

  const submit = form.handleSubmit(async (values) => {
    setOutcome({ kind: 'idle' });
    try {
      const next = await onSubmit(values);
      if (next) form.reset(next);
      else form.reset(form.getValues());
      setOutcome({ kind: 'saved', message: savedMessage });
    } catch (error) {
      // 409 is either "someone else saved first" (optimistic lock) or a clash of a value on screen
      // with another record (a code already used), which carries the field's path.
      if (isApiError(error) && error.status === 409 && !error.fields.some((f) => registry.has(f.path))) {
        setOutcome({ kind: 'conflict', message: error.message });
        return;
      }
      const unplaced: { path: string; message: string }[] = [];
      if (isApiError(error)) {
        for (const field of error.fields) {
          if (registry.has(field.path)) {
            form.setError(field.path as Path<z.input<S>>, { type: 'server', message: field.message }, { shouldFocus: unplaced.length === 0 });
          } else unplaced.push(field);
        }
        for (const issue of error.issues) unplaced.push({ path: issue.item, message: issue.message });
      }
      const message = error instanceof Error ? error.message : 'The save failed.';
      setOutcome({ kind: 'failed', message, unplaced });
    }
  });

  const reload = async () => {
    if (!onReload) return;
    setReloading(true);
    try {
      const fresh = await onReload();
      form.reset(fresh);
      setOutcome({ kind: 'idle' });
    } catch (error) {
      setOutcome({ kind: 'failed', message: error instanceof Error ? error.message : 'Reload failed.', unplaced: [] });
    } finally {
      setReloading(false);
    }
  };

  const clientErrorCount = Object.keys(form.formState.errors).length;

  return (
    <FieldRegistry.Provider value={registry}>
      <FormProvider {...form}>
        <form aria-label={label} noValidate onSubmit={submit} className={`flex flex-col gap-4 ${className}`}>
          {outcome.kind === 'conflict' ? (
            <div role="alert" className="flex flex-wrap items-center justify-between gap-3 rounded border border-over-700 bg-over-50 p-3">
              <div>
                <p className="font-semibold text-over-700">
                  <span aria-hidden="true">⟳ </span>Changed by someone else
                </p>
                <p>{outcome.message || 'Someone else saved this record after you opened it.'} Your edits are still on screen.</p>
              </div>
              {onReload ? (
                <Button onClick={reload} busy={reloading} busyLabel="Reloading…">
                  Reload their version
                </Button>
              ) : null}
            </div>
          ) : null}
          {outcome.kind === 'failed' ? (
            <div role="alert" className="rounded border border-fault-700 bg-fault-50 p-3">
              <p className="font-semibold text-fault-700">
                <span aria-hidden="true">✕ </span>Not saved
              </p>
              <p>{outcome.message}</p>
              {outcome.unplaced.length > 0 ? (
                <ul className="mt-1 list-disc pl-5">
                  {outcome.unplaced.map((u) => (
                    <li key={`${u.path}:${u.message}`}>{withItem(u.path, u.message)}</li>
                  ))}
                </ul>
              ) : null}
            </div>
          ) : null}
          <fieldset disabled={readOnly || form.formState.isSubmitting} className="flex min-w-0 flex-col gap-4">
            {typeof children === 'function' ? children(form) : children}
          </fieldset>
          {!readOnly ? (
            <div className="flex items-center gap-3">
              <Button type="submit" variant="primary" busy={form.formState.isSubmitting} busyLabel="Saving…">
                {submitLabel}
              </Button>
              <Button
                variant="quiet"
                disabled={!form.formState.isDirty || form.formState.isSubmitting}
                onClick={() => {
                  form.reset();
                  setOutcome({ kind: 'idle' });
                }}
              >
                Discard changes
              </Button>
              <p role="status" aria-live="polite" className="text-sm">
                {outcome.kind === 'saved' && !form.formState.isDirty ? (
                  <span className="text-fine-700">
                    <span aria-hidden="true">✓ </span>
                    {outcome.message}
                  </span>
                ) : clientErrorCount > 0 ? (
                  <span className="text-fault-700">Check the marked fields.</span>
                ) : null}
              </p>
            </div>
          ) : null}
        </form>
      </FormProvider>
    </FieldRegistry.Provider>
  );
}

export function useFieldError(name: string): string | undefined {
  const { formState } = useFormContext();
  const error = get(formState.errors, name) as { message?: string } | undefined;
  return error?.message;
}

type NumberMode = 'number' | 'optional-number';

/** A text or number input bound to the surrounding <Form> by name. */
export function FormInput({
  name,
  label,
  hideLabel,
  hint,
  type = 'text',
  number,
  nullable,
  optional,
  className,
  fieldClassName,
  ...rest
}: {
  name: string;
  label: string;
  hideLabel?: boolean;
  hint?: string;
  type?: string;
  /** Parse the text as a number ('optional-number': empty means null). */
  number?: NumberMode;
  /** Empty text means null (optional text such as a note). */
  nullable?: boolean;
  /** Empty text means "not given" (undefined), for optional fields. */
  optional?: boolean;
  className?: string;
  fieldClassName?: string;
  step?: string;
  min?: number;
  max?: number;
  autoComplete?: string;
  placeholder?: string;
}) {
  const { register } = useFormContext();
  useRegisteredName(name);
  const error = useFieldError(name);
  const registration = register(name, {
    setValueAs: number
      ? (v: unknown) => {
          if (v === '' || v === null || v === undefined) return number === 'optional-number' ? null : undefined;
          if (typeof v === 'number') return v;
          const n = Number(String(v).replace(',', '.'));
          return Number.isNaN(n) ? v : n;
        }
      : nullable
        ? (v: unknown) => (v === '' || v === undefined ? null : v)
        : optional
          ? (v: unknown) => (v === '' || v === null ? undefined : v)
          : undefined,
  });
  return (
    <Input
      {...registration}
      {...rest}
      type={number ? 'text' : type}
      inputMode={number ? 'decimal' : undefined}
      label={label}
      hideLabel={hideLabel}
      hint={hint}
      error={error}
      className={className}
      fieldClassName={fieldClassName}
    />
  );
}

export function FormSelect({
  name,
  label,
  hideLabel,
  hint,
  options,
  placeholder,
  number,
  fieldClassName,
}: {
  name: string;
  label: string;
  hideLabel?: boolean;
  hint?: string;
  options: readonly SelectOption[];
  placeholder?: string;
  /** Option values are numbers (ids). */
  number?: boolean;
  fieldClassName?: string;
}) {
  const { register } = useFormContext();
  useRegisteredName(name);
  const error = useFieldError(name);
  return (
    <Select
      {...register(name, { setValueAs: number ? (v: unknown) => (v === '' || v == null ? null : Number(v)) : undefined })}
      label={label}
      hideLabel={hideLabel}
      hint={hint}
      options={options}
      placeholder={placeholder}
      error={error}
      fieldClassName={fieldClassName}
    />
  );
}

export function FormCheckbox({ name, label }: { name: string; label: string }) {
  const { register } = useFormContext();
  useRegisteredName(name);
  const error = useFieldError(name);
  return <Checkbox {...register(name)} label={label} error={error} />;
}
