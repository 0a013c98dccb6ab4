import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from "react";

const control =
  "mt-1 block w-full rounded border border-rule bg-white px-2.5 py-1.5 text-sm text-ink placeholder:text-ink/40 focus:border-copper focus:outline-none";

interface FieldProps {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
}

// Every input carries a visible label and, when the server refuses it, the reason right under it.
export function TextField({ label, error, hint, className = "", ...rest }: FieldProps & InputHTMLAttributes<HTMLInputElement>) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <input
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={`${control} ${error ? "border-signal" : ""}`}
        {...rest}
      />
      {hint && !error && (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink/60">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="mt-1 text-xs text-signal">
          {error}
        </p>
      )}
    </div>
  );
}

export function SelectField({ label, error, className = "", children, ...rest }: FieldProps & SelectHTMLAttributes<HTMLSelectElement>) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <select id={id} className={control} {...rest}>
        {children}
      </select>
      {error && <p className="mt-1 text-xs text-signal">{error}</p>}
    </div>
  );
}

export const controlClass = control;
