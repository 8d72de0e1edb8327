import {
  Button,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
} from '@fluentui/react-components';
import { errorMessage } from './form-errors';

export function Loading({ label }: { label: string }) {
  return <Spinner label={label} labelPosition="below" />;
}

/** A failed request says what failed and offers to try again. */
export function RequestFailed({
  what,
  error,
  onRetry,
}: {
  what: string;
  error: unknown;
  onRetry: () => void;
}) {
  return (
    <MessageBar intent="error" role="alert" layout="multiline">
      <MessageBarBody>
        <MessageBarTitle>Could not load {what}</MessageBarTitle>
        {errorMessage(error)}
      </MessageBarBody>
      <MessageBarActions>
        <Button onClick={onRetry}>Retry</Button>
      </MessageBarActions>
    </MessageBar>
  );
}
