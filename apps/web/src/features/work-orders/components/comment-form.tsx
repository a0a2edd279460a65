import { zodResolver } from '@hookform/resolvers/zod';
import { commentInputSchema } from '@stringfield/shared';
import { useForm } from 'react-hook-form';
import { toast } from '@/lib/toast';
import { Button } from '@/components/ui/button';
import { FormField, Textarea } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';
import { splitServerErrors } from '@/lib/form-errors';
import { useAddComment } from '../api/add-comment';

/** A note on the ticket's timeline. What was typed stays if sending fails; it clears only once it is saved. */
export function CommentForm({ workOrderId }: { workOrderId: number }) {
  const addComment = useAddComment();
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors },
  } = useForm({ resolver: zodResolver(commentInputSchema), defaultValues: { body: '' } });

  const onSubmit = handleSubmit(({ body }) => {
    addComment.mutate(
      { id: workOrderId, body },
      {
        onSuccess: () => {
          reset({ body: '' });
          toast.success('Comment added');
        },
        onError: (error) => {
          const split = splitServerErrors(error, ['body'] as const);
          setError('body', {
            type: 'server',
            message: split.fieldErrors[0]?.[1] ?? split.formError ?? 'The comment was not saved. Try again.',
          });
        },
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      <FormField
        label="Add a note to the history"
        hint="For the team on this ticket; it does not go into the close-out report. Mention someone with @ and the start of their e-mail, like @rosa.quill."
        error={errors.body?.message}
      >
        <Textarea rows={3} maxLength={5000} {...register('body')} />
      </FormField>
      <div>
        <Button
          type="submit"
          variant="secondary"
          isPending={addComment.isPending}
          className="w-full sm:w-auto"
        >
          {addComment.isPending ? null : <Icon name="chat" />}
          Add comment
        </Button>
      </div>
    </form>
  );
}
