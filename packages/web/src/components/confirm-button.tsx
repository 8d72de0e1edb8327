import {
  Body1,
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { useRef, useState } from 'react';
import { FormError } from './form-error';
import { errorMessage } from './form-errors';

const useStyles = makeStyles({
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

export interface ConfirmButtonProps {
  /** The button's text in the row ("Remove"). */
  text: string;
  /** Its accessible name, which says whom it acts on ("Remove Ilse Darrow"). */
  name: string;
  title: string;
  description: string;
  confirmText: string;
  pending: boolean;
  /** The failure of the last attempt; shown in the dialog, which then stays open. */
  error: unknown;
  /** Called when the dialog opens, to forget an earlier failure. */
  onOpen: () => void;
  /** Runs the action; `close` is called once it has succeeded. */
  onConfirm: (close: () => void) => void;
  /** The label of the button that closes the dialog without acting ("Cancel"). */
  cancelText?: string;
  /** Small in a table row (the default), medium on its own under a form. */
  size?: 'small' | 'medium';
}

/**
 * An action that asks first, naming what it affects, and shows the server's refusal where it was
 * asked (removing a member, revoking an invitation, deleting a body or an event). The dialog is mounted only while open: a Fluent dialog switched open in place stayed
 * aria-hidden under jsdom, out of the tests' reach, while one mounted open does not.
 */
export function ConfirmButton(props: ConfirmButtonProps) {
  const styles = useStyles();
  const [open, setOpen] = useState(false);
  const buttonRef = useRef<HTMLButtonElement>(null);
  const close = () => {
    setOpen(false);
    buttonRef.current?.focus();
  };
  return (
    <>
      <Button
        ref={buttonRef}
        size={props.size ?? 'small'}
        aria-label={props.name}
        aria-haspopup="dialog"
        onClick={() => {
          props.onOpen();
          setOpen(true);
        }}
      >
        {props.text}
      </Button>
      {open ? (
        <Dialog
          open
          modalType="alert"
          onOpenChange={(_, data) => {
            if (!data.open) close();
          }}
        >
          <DialogSurface>
            <DialogBody>
              <DialogTitle>{props.title}</DialogTitle>
              <DialogContent className={styles.content}>
                <Body1 as="p">{props.description}</Body1>
                {props.error !== null && props.error !== undefined ? (
                  <FormError title={`${props.confirmText} failed`} message={errorMessage(props.error)} />
                ) : null}
              </DialogContent>
              <DialogActions>
                <Button appearance="primary" disabled={props.pending} onClick={() => props.onConfirm(close)}>
                  {props.confirmText}
                </Button>
                <Button disabled={props.pending} onClick={close}>
                  {props.cancelText ?? 'Cancel'}
                </Button>
              </DialogActions>
            </DialogBody>
          </DialogSurface>
        </Dialog>
      ) : null}
    </>
  );
}
