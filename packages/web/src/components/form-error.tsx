import { MessageBar, MessageBarBody, MessageBarTitle } from '@fluentui/react-components';

/** A failed submission, announced to screen readers as it appears. */
export function FormError({ title, message }: { title: string; message: string }) {
  return (
    <MessageBar intent="error" role="alert">
      <MessageBarBody>
        <MessageBarTitle>{title}</MessageBarTitle>
        {message}
      </MessageBarBody>
    </MessageBar>
  );
}
