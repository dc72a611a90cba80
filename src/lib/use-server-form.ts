import { zodResolver } from '@hookform/resolvers/zod';
import { type DefaultValues, type FieldValues, type Path, useForm } from 'react-hook-form';
import type { z } from 'zod';
import { useToast } from '../components/ui/toast.tsx';
import { applyServerErrors } from './form-errors.ts';

/**
 * A form checked in the browser by the zod schema the API uses, whose submit runs `submit`. When the
 * server refuses, each of its messages about one of `fields` goes next to that input; any other
 * refusal shows in a toast. Returns react-hook-form's form, `onSubmit` for the <form>, and
 * `formProps` (that and whether the submit is running) for SubmitForm.
 */
export function useServerForm<T extends FieldValues>({
  schema,
  defaultValues,
  fields,
  submit,
}: {
  schema: z.ZodType<T, T>;
  defaultValues: DefaultValues<T>;
  fields: ReadonlyArray<Path<T>>;
  submit: (values: T) => Promise<void>;
}) {
  const toast = useToast();
  const form = useForm<T>({ resolver: zodResolver(schema), defaultValues });
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await submit(values);
    } catch (error) {
      const message = applyServerErrors(error, form.setError, fields);
      if (message) toast.error(message);
    }
  });
  return { ...form, onSubmit, formProps: { onSubmit, pending: form.formState.isSubmitting } };
}
