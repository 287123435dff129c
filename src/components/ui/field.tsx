import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from 'react';
import { cx } from '../../lib/cx.ts';

/** Props a field hands to its control so label, hint and error are wired for assistive tech. */
export interface ControlProps {
  id: string;
  'aria-invalid': boolean | undefined;
  'aria-describedby': string | undefined;
}

export interface FieldProps {
  label: ReactNode;
  /** The message shown under the control when its value is refused. */
  error?: string;
  hint?: ReactNode;
  className?: string;
  children: (control: ControlProps) => ReactNode;
}

/** A label, a control, a hint and an error message, linked by ids. */
export function Field({ label, error, hint, className, children }: FieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={cx('flex flex-col gap-1.5', className)}>
      <label htmlFor={id} className="text-sm font-semibold text-ink-800">
        {label}
      </label>
      {children({ id, 'aria-invalid': error ? true : undefined, 'aria-describedby': describedBy })}
      {hint && (
        <p id={hintId} className="text-sm text-ink-600">
          {hint}
        </p>
      )}
      {error && (
        <p id={errorId} className="text-sm font-medium text-danger-700">
          {error}
        </p>
      )}
    </div>
  );
}

export const controlClasses = cx(
  'block w-full min-h-11 rounded-control border bg-white px-3 text-base text-ink-900',
  'border-ink-300 placeholder:text-ink-400',
  'aria-invalid:border-danger-600 aria-invalid:bg-danger-50',
  'disabled:bg-ink-100 disabled:text-ink-500',
);

type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> & {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
};

export function TextField({ label, error, hint, className, ...input }: TextFieldProps) {
  return (
    <Field label={label} error={error} hint={hint} className={className}>
      {(control) => <input className={controlClasses} {...control} {...input} />}
    </Field>
  );
}

type SelectFieldProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> & {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
};

export function SelectField({ label, error, hint, className, children, ...select }: SelectFieldProps) {
  return (
    <Field label={label} error={error} hint={hint} className={className}>
      {(control) => (
        <select className={controlClasses} {...control} {...select}>
          {children}
        </select>
      )}
    </Field>
  );
}

type CheckboxFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'id' | 'type'> & {
  label: ReactNode;
  hint?: ReactNode;
};

export function CheckboxField({ label, hint, className, ...input }: CheckboxFieldProps) {
  const id = useId();
  return (
    <div className={cx('flex items-start gap-3', className)}>
      <input id={id} type="checkbox" className="mt-1 size-5 accent-tide-600" aria-describedby={hint ? `${id}-hint` : undefined} {...input} />
      <div>
        <label htmlFor={id} className="font-semibold text-ink-800">
          {label}
        </label>
        {hint && (
          <p id={`${id}-hint`} className="text-sm text-ink-600">
            {hint}
          </p>
        )}
      </div>
    </div>
  );
}

export interface Choice<V extends string> {
  value: V;
  label: ReactNode;
}

interface ChoiceGroupProps<V extends string> {
  legend: ReactNode;
  name: string;
  value: V;
  choices: ReadonlyArray<Choice<V>>;
  onChange: (value: V) => void;
  disabled?: boolean;
  error?: string;
  hint?: ReactNode;
}

/** A small set of exclusive options as a row of radio buttons (segmented look). */
export function ChoiceGroup<V extends string>({ legend, name, value, choices, onChange, disabled, error, hint }: ChoiceGroupProps<V>) {
  const id = useId();
  return (
    <fieldset className="flex flex-col gap-1.5" aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}>
      <legend className="mb-1.5 text-sm font-semibold text-ink-800">{legend}</legend>
      <div className="inline-flex w-fit flex-wrap overflow-hidden rounded-control border border-ink-300 bg-white">
        {choices.map((choice) => (
          <label
            key={choice.value}
            className={cx(
              'flex min-h-11 min-w-20 cursor-pointer items-center justify-center px-4 font-semibold',
              'border-ink-300 not-first:border-l has-focus-visible:outline-3 has-focus-visible:outline-focus',
              choice.value === value ? 'bg-tide-600 text-white' : 'text-ink-800 hover:bg-ink-50',
              disabled && 'cursor-not-allowed opacity-60',
            )}
          >
            <input
              type="radio"
              className="sr-only"
              name={name}
              value={choice.value}
              checked={choice.value === value}
              disabled={disabled}
              onChange={() => onChange(choice.value)}
            />
            {choice.label}
          </label>
        ))}
      </div>
      {hint && (
        <p id={`${id}-hint`} className="text-sm text-ink-600">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-sm font-medium text-danger-700">
          {error}
        </p>
      )}
    </fieldset>
  );
}
