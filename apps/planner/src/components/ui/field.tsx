import { useId, type InputHTMLAttributes, type ReactNode, type Ref, type SelectHTMLAttributes } from 'react';

const controlClasses =
  'w-full rounded border border-line bg-panel px-2 py-1.5 text-ink disabled:bg-paper disabled:text-ink-soft aria-[invalid=true]:border-fault-700';

type FieldFrameProps = {
  label: string;
  /** The label stays for screen readers but is not drawn (inputs inside table rows). */
  hideLabel?: boolean;
  hint?: string;
  error?: string;
  children: (ids: { id: string; describedBy?: string; invalid: boolean }) => ReactNode;
  className?: string;
  /** A fixed id for the control (otherwise one is generated). */
  id?: string;
};

/** A label, the control, a hint and the error message, tied together for assistive technology. */
export function Field({ label, hideLabel, hint, error, children, className = '', id: fixedId }: FieldFrameProps) {
  const generatedId = useId();
  const id = fixedId ?? generatedId;
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className={hideLabel ? 'sr-only' : 'text-sm font-semibold'}>
        {label}
      </label>
      {children({ id, describedBy, invalid: Boolean(error) })}
      {hint ? (
        <p id={hintId} className="text-xs text-ink-soft">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errorId} className="text-sm text-fault-700">
          <span aria-hidden="true">✕ </span>
          {error}
        </p>
      ) : null}
    </div>
  );
}

type InputProps = InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  hideLabel?: boolean;
  hint?: string;
  error?: string;
  ref?: Ref<HTMLInputElement>;
  fieldClassName?: string;
};

export function Input({ label, hideLabel, hint, error, fieldClassName, className = '', id: fixedId, ...rest }: InputProps) {
  return (
    <Field label={label} hideLabel={hideLabel} hint={hint} error={error} className={fieldClassName} id={fixedId}>
      {({ id, describedBy, invalid }) => (
        <input
          id={id}
          aria-describedby={describedBy}
          aria-invalid={invalid || undefined}
          className={`${controlClasses} ${className}`}
          {...rest}
        />
      )}
    </Field>
  );
}

export type SelectOption = { value: string; label: string };

type SelectProps = SelectHTMLAttributes<HTMLSelectElement> & {
  label: string;
  hideLabel?: boolean;
  hint?: string;
  error?: string;
  options: readonly SelectOption[];
  /** Text of an empty first choice, when the value may be unset. */
  placeholder?: string;
  ref?: Ref<HTMLSelectElement>;
  fieldClassName?: string;
};

export function Select({ label, hideLabel, hint, error, options, placeholder, fieldClassName, className = '', children, id: fixedId, ...rest }: SelectProps) {
  return (
    <Field label={label} hideLabel={hideLabel} hint={hint} error={error} className={fieldClassName} id={fixedId}>
      {({ id, describedBy, invalid }) => (
        <select
          id={id}
          aria-describedby={describedBy}
          aria-invalid={invalid || undefined}
          className={`${controlClasses} ${className}`}
          {...rest}
        >
          {placeholder !== undefined ? <option value="">{placeholder}</option> : null}
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
          {children}
        </select>
      )}
    </Field>
  );
}

type CheckboxProps = InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; ref?: Ref<HTMLInputElement> };

export function Checkbox({ label, error, className = '', ...rest }: CheckboxProps) {
  const id = useId();
  const errorId = `${id}-error`;
  return (
    <div className="flex flex-col gap-1">
      <div className="flex items-center gap-2">
        <input
          id={id}
          type="checkbox"
          className={`h-4 w-4 accent-race-700 ${className}`}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? errorId : undefined}
          {...rest}
        />
        <label htmlFor={id} className="text-sm font-semibold">
          {label}
        </label>
      </div>
      {error ? (
        <p id={errorId} className="text-sm text-fault-700">
          <span aria-hidden="true">✕ </span>
          {error}
        </p>
      ) : null}
    </div>
  );
}
