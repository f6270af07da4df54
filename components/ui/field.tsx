import { cn } from "@/lib/cn";

export interface FieldProps {
  id: string;
  label: string;
  hint?: string;
  errors?: string[] | string;
  children: React.ReactNode;
  className?: string;
}

/** A label, the control, an optional hint and the field's errors, wired with aria-describedby. */
export function Field({ id, label, hint, errors, children, className }: FieldProps) {
  const list = typeof errors === "string" ? [errors] : (errors ?? []);
  return (
    <div className={cn("flex flex-col gap-1", className)}>
      <label htmlFor={id} className="text-sm font-bold text-ink">
        {label}
      </label>
      {children}
      {hint ? (
        <p id={`${id}-hint`} className="text-2xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      <div id={`${id}-error`} aria-live="polite" className="text-sm text-bad">
        {list.map((message) => (
          <p key={message}>
            <span aria-hidden="true">✖ </span>
            {message}
          </p>
        ))}
      </div>
    </div>
  );
}

export function describedBy(id: string, hasHint = false) {
  return [hasHint ? `${id}-hint` : null, `${id}-error`].filter(Boolean).join(" ");
}

export const inputClasses =
  "min-h-10 w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-base text-ink placeholder:text-ink-faint aria-[invalid=true]:border-bad";

export interface TextFieldProps {
  id: string;
  name: string;
  label: string;
  hint?: string;
  errors?: string[];
  defaultValue?: string;
  type?: "text" | "date" | "file";
  inputMode?: "numeric" | "decimal";
  accept?: string;
  autoComplete?: string;
  /** Rows of a multi-line field; omitted for a one-line input. */
  rows?: number;
  className?: string;
  inputClassName?: string;
}

/** A labelled input or textarea with its hint and errors, wired for screen readers: the common form row. */
export function TextField({
  id,
  name,
  label,
  hint,
  errors,
  defaultValue,
  type = "text",
  inputMode,
  accept,
  autoComplete,
  rows,
  className,
  inputClassName,
}: TextFieldProps) {
  const shared = {
    id,
    name,
    defaultValue,
    className: cn(inputClasses, inputClassName),
    "aria-invalid": Boolean(errors?.length),
    "aria-describedby": describedBy(id, Boolean(hint)),
  };
  return (
    <Field id={id} label={label} hint={hint} errors={errors} className={className}>
      {rows ? (
        <textarea rows={rows} {...shared} />
      ) : (
        <input type={type} inputMode={inputMode} accept={accept} autoComplete={autoComplete} {...shared} />
      )}
    </Field>
  );
}
