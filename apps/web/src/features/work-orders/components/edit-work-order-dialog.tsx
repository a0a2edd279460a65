import { zodResolver } from '@hookform/resolvers/zod';
import {
  createWorkOrderInputSchema,
  faultCategories,
  faultCategoryLabels,
  faultCategorySchema,
  priorities,
  priorityLabels,
  prioritySchema,
  updateWorkOrderInputSchema,
  type UpdateWorkOrderInput,
  type WorkOrderDetail,
} from '@stringfield/shared';
import { useForm } from 'react-hook-form';
import { toast } from '@/lib/toast';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormField, Input, Select, Textarea } from '@/components/ui/form-field';
import { splitServerErrors } from '@/lib/form-errors';
import { isConflict } from '../api/conflict';
import { useUpdateWorkOrder } from '../api/update-work-order';
import { fromSiteInputValue, toSiteInputValue } from '../lib/sla';
import { ConflictBanner } from './conflict-banner';

/* The shared update schema, with the due time as the site-time value a datetime-local input gives. */
const editFormSchema = z.object({
  title: createWorkOrderInputSchema.shape.title,
  description: createWorkOrderInputSchema.shape.description,
  priority: prioritySchema,
  faultCategory: faultCategorySchema,
  dueLocal: z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, 'Pick a date and time'),
});
type EditFormInput = z.input<typeof editFormSchema>;
type EditFormValues = z.output<typeof editFormSchema>;
const fieldNames = ['title', 'description', 'priority', 'faultCategory', 'dueAt'] as const;

/**
 * Title, description, priority, fault category and due time, saved only if nobody changed the ticket
 * since the dialog opened (`baseVersion`). On a clash the typed values stay; Reload, then save again.
 */
export function EditWorkOrderDialog({
  ticket,
  baseVersion,
  conflictMessage,
  onConflict,
  onReload,
  isReloading,
  onClose,
}: {
  ticket: WorkOrderDetail;
  baseVersion: number;
  conflictMessage: string | undefined;
  onConflict: (message: string) => void;
  onReload: () => void;
  isReloading: boolean;
  onClose: () => void;
}) {
  const update = useUpdateWorkOrder();
  const tz = ticket.site.timeZone;
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<EditFormInput, unknown, EditFormValues>({
    resolver: zodResolver(editFormSchema),
    defaultValues: {
      title: ticket.title,
      description: ticket.description,
      priority: ticket.priority,
      faultCategory: ticket.faultCategory,
      dueLocal: toSiteInputValue(ticket.dueAt, tz),
    },
  });

  const onSubmit = handleSubmit((values) => {
    const dueAt = fromSiteInputValue(values.dueLocal, tz);
    const input: UpdateWorkOrderInput = updateWorkOrderInputSchema.parse({
      version: baseVersion,
      title: values.title,
      description: values.description,
      priority: values.priority,
      faultCategory: values.faultCategory,
      dueAt,
    });
    update.mutate(
      { id: ticket.id, input },
      {
        onSuccess: (saved) => {
          toast.success(`${saved.number} saved`);
          onClose();
        },
        onError: (error) => {
          if (isConflict(error)) {
            onConflict(error.message);
            return;
          }
          const split = splitServerErrors(error, fieldNames);
          for (const [name, message] of split.fieldErrors)
            setError(
              name === 'dueAt' ? 'dueLocal' : name,
              { type: 'server', message },
              { shouldFocus: true },
            );
          if (split.formError) setError('root', { type: 'server', message: split.formError });
        },
      },
    );
  });

  return (
    <Dialog
      isOpen
      onClose={onClose}
      title={`Edit ${ticket.number}`}
      description="Changes are recorded in the ticket's history."
    >
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
        {conflictMessage ? (
          <ConflictBanner message={conflictMessage} onReload={onReload} isReloading={isReloading} />
        ) : null}
        <div aria-live="assertive" className="empty:hidden">
          {errors.root?.message ? <Alert tone="fail">{errors.root.message}</Alert> : null}
        </div>
        <FormField label="Title" error={errors.title?.message}>
          <Input maxLength={160} {...register('title')} />
        </FormField>
        <div className="grid gap-5 sm:grid-cols-2">
          <FormField label="Priority" error={errors.priority?.message}>
            <Select {...register('priority')}>
              {priorities.map((p) => (
                <option key={p} value={p}>
                  {priorityLabels[p]}
                </option>
              ))}
            </Select>
          </FormField>
          <FormField label="Fault category" error={errors.faultCategory?.message}>
            <Select {...register('faultCategory')}>
              {faultCategories.map((c) => (
                <option key={c} value={c}>
                  {faultCategoryLabels[c]}
                </option>
              ))}
            </Select>
          </FormField>
        </div>
        <FormField
          label={`Due (site time, ${tz})`}
          hint="Changing the priority does not move the due time; set it here if it should."
          error={errors.dueLocal?.message}
        >
          <Input type="datetime-local" {...register('dueLocal')} />
        </FormField>
        <FormField label="Description" isOptional error={errors.description?.message}>
          <Textarea rows={4} maxLength={5000} {...register('description')} />
        </FormField>
        <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
          <Button variant="secondary" onClick={onClose} disabled={update.isPending}>
            Cancel
          </Button>
          <Button type="submit" variant="primary" isPending={update.isPending}>
            Save changes
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
