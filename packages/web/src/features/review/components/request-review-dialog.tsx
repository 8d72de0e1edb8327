import {
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  DialogTrigger,
  Field,
  Textarea,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { reviewRequestInputSchema, useRequestReview } from '../api/request-review';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';

/** "Request review" opens a box for an optional message to the reviewers, sent with the request. */
export function RequestReviewDialog({ fitId, fitLabel }: { fitId: string; fitLabel: string }) {
  const [open, setOpen] = useState(false);
  const [message, setMessage] = useState('');
  const [messageError, setMessageError] = useState<string | undefined>();
  const request = useRequestReview(fitId);

  const reset = () => {
    setMessage('');
    setMessageError(undefined);
    request.reset();
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = reviewRequestInputSchema.safeParse({ message });
    if (!parsed.success) {
      setMessageError(parsed.error.issues[0]?.message);
      return;
    }
    setMessageError(undefined);
    request.mutate(parsed.data, {
      onSuccess: () => {
        setOpen(false);
        reset();
      },
    });
  };

  return (
    <Dialog
      open={open}
      onOpenChange={(_, data) => {
        setOpen(data.open);
        if (!data.open) reset();
      }}
    >
      <DialogTrigger disableButtonEnhancement>
        <Button appearance="primary">Request review</Button>
      </DialogTrigger>
      <DialogSurface>
        <form onSubmit={submit} noValidate aria-label="Review request">
          <DialogBody>
            <DialogTitle>Ask for a review of {fitLabel}</DialogTitle>
            <DialogContent>
              <Field
                label="Message to the reviewers (optional)"
                hint="What to look at, what changed since the last review. It goes with the e-mail and stays in the history."
                validationMessage={messageError}
              >
                <Textarea value={message} onChange={(_, data) => setMessage(data.value)} resize="vertical" />
              </Field>
              {request.isError ? (
                <FormError title="Review was not requested" message={errorMessage(request.error)} />
              ) : null}
            </DialogContent>
            <DialogActions>
              <DialogTrigger disableButtonEnhancement>
                <Button>Cancel</Button>
              </DialogTrigger>
              <Button appearance="primary" type="submit" disabled={request.isPending}>
                {request.isPending ? 'Sending…' : 'Send request'}
              </Button>
            </DialogActions>
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
