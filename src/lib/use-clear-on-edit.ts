import { useEffect, useEffectEvent } from 'react';
import type { FieldValues, UseFormWatch } from 'react-hook-form';

/**
 * Calls `clear` when the person edits any field of `form`: the message of the last attempt must not stand beside
 * an input that has changed since (a wrong password stays on screen while the right one is typed). Pass what
 * clears the form's own message: `setFormError(null)`, `mutation.reset()`, or both.
 */
export function useClearOnEdit<T extends FieldValues>(form: { watch: UseFormWatch<T> }, clear: () => void): void {
  const onEdit = useEffectEvent(clear);
  useEffect(() => {
    const subscription = form.watch((_values, { type }) => {
      if (type === 'change') onEdit();
    });
    return () => subscription.unsubscribe();
  }, [form]);
}
