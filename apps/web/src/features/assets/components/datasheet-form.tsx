import type { ReactNode } from 'react';
import { get, type FieldValues, type Path, type UseFormReturn } from 'react-hook-form';
import { toast } from '@/lib/toast';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormField, Input } from '@/components/ui/form-field';
import { splitServerErrors } from '@/lib/form-errors';
import { parseDecimal } from '../lib/parse-decimal';
import { QuantityInput } from './quantity-input';

/** One number input of a datasheet form, shown with its unit. */
export type DatasheetNumberField<Name extends string> = { name: Name; label: string; unit: string; hint?: string; isOptional?: boolean };

type SaveCallbacks<TModel> = { onSuccess: (saved: TModel) => void; onError: (error: unknown) => void };
type Mutation<TVariables, TModel> = { isPending: boolean; mutate: (variables: TVariables, callbacks: SaveCallbacks<TModel>) => void };

/** The dialog around a datasheet form; the form is made fresh each time it opens. */
export function DatasheetDialog({
  isOpen,
  onClose,
  title,
  description,
  children,
}: {
  isOpen: boolean;
  onClose: () => void;
  title: string;
  description: string;
  children: ReactNode;
}) {
  return (
    <Dialog isOpen={isOpen} onClose={onClose} title={title} description={description} className="w-[min(100%-1.5rem,44rem)]">
      {isOpen ? children : null}
    </Dialog>
  );
}

/**
 * Maker, model (and `identityExtra`), then the datasheet's numbers under `legend`. Saving creates or
 * replaces the datasheet; the server's field errors land on their inputs, the rest above the form.
 */
export function DatasheetForm<TValues extends FieldValues & { maker?: string; model?: string }, TInput, TModel extends { id: number; model: string }>({
  form,
  model,
  create,
  update,
  fieldNames,
  numberFields,
  legend,
  identityExtra,
  onDone,
}: {
  form: UseFormReturn<TValues, unknown, TInput>;
  model: TModel | null;
  create: Mutation<TInput, TModel>;
  update: Mutation<{ id: number; input: TInput }, TModel>;
  fieldNames: readonly Path<TValues>[];
  numberFields: DatasheetNumberField<Path<TValues>>[];
  legend: string;
  identityExtra?: ReactNode;
  onDone: () => void;
}) {
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = form;
  const isPending = create.isPending || update.isPending;
  const errorOf = (name: Path<TValues>) => get<typeof errors, { message?: string } | undefined>(errors, name)?.message;

  const onError = (error: unknown) => {
    const split = splitServerErrors(error, fieldNames);
    for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message }, { shouldFocus: true });
    if (split.formError) setError('root', { type: 'server', message: split.formError });
  };
  const onSubmit = handleSubmit((input) => {
    const onSuccess = (saved: TModel) => {
      toast.success(model ? `${saved.model} is updated` : `${saved.model} is in the library`);
      onDone();
    };
    if (model) update.mutate({ id: model.id, input }, { onSuccess, onError });
    else create.mutate(input, { onSuccess, onError });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <div aria-live="assertive" className="empty:hidden">
        {errors.root?.message ? <Alert tone="fail">{errors.root.message}</Alert> : null}
      </div>
      <div className="grid gap-5 sm:grid-cols-2">
        <FormField label="Maker" error={errorOf('maker' as Path<TValues>)}>
          <Input autoComplete="off" {...register('maker' as Path<TValues>)} />
        </FormField>
        <FormField label="Model" error={errorOf('model' as Path<TValues>)}>
          <Input autoComplete="off" spellCheck={false} {...register('model' as Path<TValues>)} />
        </FormField>
        {identityExtra}
      </div>
      <fieldset className="grid gap-5 sm:grid-cols-2 lg:grid-cols-3">
        <legend className="mb-2 font-semibold">{legend}</legend>
        {numberFields.map((f) => (
          <FormField key={f.name} label={f.label} hint={f.hint} isOptional={f.isOptional} error={errorOf(f.name)}>
            <QuantityInput unit={f.unit} {...register(f.name, { setValueAs: parseDecimal })} />
          </FormField>
        ))}
      </fieldset>
      <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
        <Button variant="secondary" onClick={onDone} disabled={isPending}>
          Cancel
        </Button>
        <Button type="submit" variant="primary" isPending={isPending}>
          {model ? 'Save changes' : 'Add datasheet'}
        </Button>
      </div>
    </form>
  );
}
