import { zodResolver } from '@hookform/resolvers/zod';
import { useState, type ReactNode } from 'react';
import {
  useForm,
  type DefaultValues,
  type FieldErrors,
  type FieldValues,
  type Path,
  type UseFormReturn,
} from 'react-hook-form';
import { toast } from 'sonner';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { ApiError, errorMessage } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { parseDollarsToCents } from '@/shared/parse-money';

/** Dollars as typed ("1,250.50", "$12") to integer cents, then the server's own field. */
export function dollarsText(field: z.ZodType<number, number>, what: string) {
  return z
    .string()
    .trim()
    .min(1, `${what} is required`)
    .transform((text, ctx) => {
      const cents = parseDollarsToCents(text);
      if (cents === null) {
        ctx.addIssue({ code: 'custom', message: 'Type dollars like 62.50 (two decimals at most)' });
        return z.NEVER;
      }
      return cents;
    })
    .pipe(field);
}

const readNumber = (text: string, ctx: z.RefinementCtx) => {
  const cleaned = text.replace(/,/g, '');
  const value = /^-?\d*\.?\d+$/.test(cleaned) ? Number(cleaned) : Number.NaN;
  if (Number.isNaN(value)) {
    ctx.addIssue({ code: 'custom', message: 'Type a number, like 12.5' });
    return z.NEVER;
  }
  return value;
};

/** A typed number ("1,250", "12.5"), then the server's own field. */
export function numberText(field: z.ZodType<number, number>, what: string) {
  return z.string().trim().min(1, `${what} is required`).transform(readNumber).pipe(field);
}

/** The same, or null when the box is left empty. */
export function optionalNumberText(field: z.ZodType<number, number>, _what: string) {
  return z
    .string()
    .trim()
    .transform((text, ctx) => (text === '' ? null : readNumber(text, ctx)))
    .pipe(field.nullable());
}

/** Labels of the form's fields and of its row lists, for messages that name the row and the field. */
export type Labels = Record<string, string>;

/**
 * Every message of a form as "Labor, row 2, rate: ..." (row lists) or "Gross: ..." (single fields), so a refusal
 * says what and where even when the field is off screen.
 */
export function errorLines(errors: FieldErrors, labels: Labels, prefix = ''): string[] {
  return Object.entries(errors).flatMap(([key, value]) => {
    if (!value) return [];
    const name = labels[prefix ? `${prefix}.${key}` : key] ?? labels[key] ?? key;
    // A row list: an array, or (with a message about the whole list) an object of row indexes and `root`.
    const entries = Object.entries(value as object);
    if (Array.isArray(value) || entries.some(([k]) => /^\d+$/.test(k) || k === 'root')) {
      const rows = entries.flatMap(([k, row]) =>
        /^\d+$/.test(k) && row
          ? errorLines(row as FieldErrors, labels, prefix ? `${prefix}.${key}` : key).map(
              (m) => `${name}, row ${Number(k) + 1}, ${m}`,
            )
          : [],
      );
      const whole =
        (value as { root?: { message?: unknown }; message?: unknown }).root?.message ??
        (value as { message?: unknown }).message;
      return typeof whole === 'string' && whole ? [...rows, `${name}: ${whole}`] : rows;
    }
    const message = (value as { message?: unknown }).message;
    if (typeof message === 'string' && message) return [`${name}: ${message}`];
    return errorLines(value as FieldErrors, labels, prefix ? `${prefix}.${key}` : key);
  });
}

/** A list of what is wrong, naming row and field; shown above the save button. */
export function ErrorSummary({ lines }: { lines: string[] }) {
  if (lines.length === 0) return null;
  return (
    <Alert>
      <ul className="flex list-disc flex-col gap-0.5 pl-4 text-xs" aria-label="What to correct">
        {lines.slice(0, 20).map((l) => (
          <li key={l}>{l}</li>
        ))}
      </ul>
    </Alert>
  );
}

/**
 * A record form: react-hook-form on the form schema (the server's schema with typed text turned into numbers),
 * the server's 400 details put on the fields by their dotted paths, anything left over listed with the rest.
 */
export function useRecordForm<In extends FieldValues, Out>(
  schema: z.ZodType<Out, In>,
  defaultValues: DefaultValues<In>,
  labels: Labels,
  save: (body: Out) => Promise<unknown>,
  done: () => void,
) {
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(schema), mode: 'onTouched', defaultValues });
  const [leftover, setLeftover] = useState<string[]>([]);
  const submit = form.handleSubmit(
    async (body) => {
      setLeftover([]);
      try {
        await save(body);
        form.reset(defaultValues);
        done();
      } catch (error) {
        const fields = error instanceof ApiError ? error.details.map((d) => d.path as Path<In>) : [];
        const rest = applyServerErrors(error, form.setError, fields);
        if (error instanceof ApiError && error.details.length === 0) rest.push(errorMessage(error));
        if (!(error instanceof ApiError)) rest.push(errorMessage(error));
        setLeftover(rest);
      }
    },
    () => setLeftover([]),
  );
  const lines = [...errorLines(form.formState.errors, labels), ...leftover];
  return { form, submit, lines };
}

type TextProps<T extends FieldValues> = {
  form: UseFormReturn<T, unknown, unknown>;
  name: Path<T>;
  label: string;
  hint?: string;
  className?: string;
  type?: 'text' | 'date';
  numeric?: boolean;
  placeholder?: string;
};

/** A labelled text box registered on the form, with its own message under it. */
export function TextBox<T extends FieldValues>({
  form,
  name,
  label,
  hint,
  className,
  type,
  numeric,
  placeholder,
}: TextProps<T>) {
  const error = name
    .split('.')
    .reduce<unknown>((e, k) => (e as Record<string, unknown> | undefined)?.[k], form.formState.errors) as
    { message?: string } | undefined;
  return (
    <Field label={label} error={error?.message} hint={hint} className={className}>
      {(control) => (
        <Input
          type={type ?? 'text'}
          inputMode={numeric ? 'decimal' : undefined}
          className={numeric ? 'num' : undefined}
          placeholder={placeholder}
          {...control}
          {...form.register(name)}
        />
      )}
    </Field>
  );
}

/** A labelled select registered on the form. */
export function SelectBox<T extends FieldValues>({
  form,
  name,
  label,
  options,
  className,
}: {
  form: UseFormReturn<T, unknown, unknown>;
  name: Path<T>;
  label: string;
  options: { value: string; label: string }[];
  className?: string;
}) {
  const error = name
    .split('.')
    .reduce<unknown>((e, k) => (e as Record<string, unknown> | undefined)?.[k], form.formState.errors) as
    { message?: string } | undefined;
  return (
    <Field label={label} error={error?.message} className={className}>
      {(control) => <Select {...control} {...form.register(name)} options={options} />}
    </Field>
  );
}

/** A command that opens a record form in a dialog; the form closes itself once saved. */
export function RecordDialog({
  command,
  title,
  description,
  children,
}: {
  command: string;
  title: string;
  description?: string;
  children: (close: () => void) => ReactNode;
}) {
  const [open, setOpen] = useState(false);
  const close = () => setOpen(false);
  return (
    <>
      <Button size="sm" variant="secondary" onClick={() => setOpen(true)}>
        {command}
      </Button>
      <Dialog
        open={open}
        onClose={close}
        title={title}
        description={description}
        className="w-[min(52rem,calc(100vw-2rem))]"
      >
        {open ? children(close) : null}
      </Dialog>
    </>
  );
}

/** Save and cancel, with the summary of what to correct above them. */
export function FormFooter({
  lines,
  saving,
  label,
  onCancel,
}: {
  lines: string[];
  saving: boolean;
  label: string;
  onCancel: () => void;
}) {
  return (
    <div className="col-span-full flex flex-col gap-2">
      <ErrorSummary lines={lines} />
      <div className="flex justify-end gap-2">
        <Button type="button" variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" disabled={saving}>
          {label}
        </Button>
      </div>
    </div>
  );
}

export const saved = (what: string) => () => toast.success(what);
