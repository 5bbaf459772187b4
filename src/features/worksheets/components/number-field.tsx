import type { UseFormRegisterReturn } from 'react-hook-form';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { cn } from '@/lib/cn';

type NumberFieldProps = {
  label: string;
  /** Printed after the label and inside the box: "ft", "sq ft", "%". */
  unit?: string;
  error?: string | undefined;
  hint?: string;
  className?: string;
  registration: UseFormRegisterReturn;
};

/** A number box registered with `valueAsNumber`; an empty box is NaN, which the shared schema reports. */
export function NumberField({ label, unit, error, hint, className, registration }: NumberFieldProps) {
  return (
    <Field label={unit ? `${label} (${unit})` : label} error={error} hint={hint} className={className}>
      {(control) => (
        <Input inputMode="decimal" type="text" className={cn('num text-right')} {...control} {...registration} />
      )}
    </Field>
  );
}

/** A bare number cell for an editable table row; its label is for screen readers. */
export function NumberCell({
  label,
  error,
  registration,
}: {
  label: string;
  error?: string | undefined;
  registration: UseFormRegisterReturn;
}) {
  return (
    <div>
      <Input
        aria-label={label}
        aria-invalid={Boolean(error)}
        title={error}
        inputMode="decimal"
        className="h-8 num text-right"
        {...registration}
      />
      {error ? <p className="mt-0.5 text-xs text-brick-700">{error}</p> : null}
    </div>
  );
}
