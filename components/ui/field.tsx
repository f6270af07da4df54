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
