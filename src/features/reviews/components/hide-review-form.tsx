import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { HIDE_REASON_MAX_CHARS, type HideReviewInput, hideReviewSchema } from '../../../../shared/schemas/review.ts';
import { Button } from '../../../components/ui/button.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { applyServerErrors } from '../../../lib/form-errors.ts';
import { useHideReview } from '../api/hide-review.ts';

/** For admins: hide a review with a reason (the reason goes into the audit log). */
export function HideReviewForm({ reviewId }: { reviewId: string }) {
  const [open, setOpen] = useState(false);
  const hide = useHideReview();
  const toast = useToast();
  const form = useForm<HideReviewInput>({ resolver: zodResolver(hideReviewSchema), defaultValues: { reason: '' } });
  const onSubmit = form.handleSubmit(async (v) => {
    try {
      await hide.mutateAsync({ id: reviewId, reason: v.reason });
      toast.success('Hidden. The reason is in the audit log.');
    } catch (e) {
      const msg = applyServerErrors(e, form.setError, ['reason']);
      if (msg) toast.error(msg);
    }
  });
  if (!open) {
    return (
      <Button variant="quiet" className="self-start" onClick={() => setOpen(true)}>
        Hide this review
      </Button>
    );
  }
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-2">
      <TextField label="Why is it hidden?" maxLength={HIDE_REASON_MAX_CHARS} error={form.formState.errors.reason?.message} {...form.register('reason')} />
      <div className="flex gap-2">
        <Button type="submit" pending={hide.isPending} pendingLabel="Hiding…">
          Hide review
        </Button>
        <Button variant="secondary" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
