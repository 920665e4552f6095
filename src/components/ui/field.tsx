import { forwardRef, type InputHTMLAttributes, type SelectHTMLAttributes, type TextareaHTMLAttributes } from "react";

const control = "w-full rounded-md border border-ink/20 bg-white px-2.5 py-1.5 text-sm shadow-sm placeholder:text-ink-muted focus:border-steel focus:outline-none focus:ring-2 focus:ring-steel/30 aria-[invalid=true]:border-red-600";

type Common = { label: string; error?: string; hint?: string; id: string };

// The error replaces the hint under the control; the control is described by whichever is shown.
const describedBy = ({ id, error, hint }: Pick<Common, "id" | "error" | "hint">) => (error ? `${id}-error` : hint ? `${id}-hint` : undefined);

function Frame({ label, error, hint, id, children }: Common & { children: React.ReactNode }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-ink/80">{label}</label>
      {children}
      {error ? <p id={`${id}-error`} className="text-xs text-red-700">{error}</p> : hint ? <p id={`${id}-hint`} className="text-xs text-ink-muted">{hint}</p> : null}
    </div>
  );
}

export const TextField = forwardRef<HTMLInputElement, Common & InputHTMLAttributes<HTMLInputElement>>(function TextField({ label, error, hint, id, ...rest }, ref) {
  return (
    <Frame label={label} error={error} hint={hint} id={id}>
      <input ref={ref} id={id} aria-invalid={!!error} aria-describedby={describedBy({ id, error, hint })} className={control} {...rest} />
    </Frame>
  );
});

export const SelectField = forwardRef<HTMLSelectElement, Common & SelectHTMLAttributes<HTMLSelectElement>>(function SelectField({ label, error, hint, id, children, ...rest }, ref) {
  return (
    <Frame label={label} error={error} hint={hint} id={id}>
      <select ref={ref} id={id} aria-invalid={!!error} aria-describedby={describedBy({ id, error, hint })} className={control} {...rest}>{children}</select>
    </Frame>
  );
});

export const TextAreaField = forwardRef<HTMLTextAreaElement, Common & TextareaHTMLAttributes<HTMLTextAreaElement>>(function TextAreaField({ label, error, hint, id, ...rest }, ref) {
  return (
    <Frame label={label} error={error} hint={hint} id={id}>
      <textarea ref={ref} id={id} aria-invalid={!!error} aria-describedby={describedBy({ id, error, hint })} className={control} rows={3} {...rest} />
    </Frame>
  );
});
