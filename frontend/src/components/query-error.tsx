import { Alert, Button } from '@chakra-ui/react';
import { isApiError } from '@/lib/api-client';

export interface QueryErrorProps {
  error: Error;
  title?: string;
  onRetry?: () => void;
}

/** The error of a first load, shown in place of the data. */
export function QueryError({ error, title = 'The data could not be loaded', onRetry }: QueryErrorProps) {
  const message = isApiError(error) ? error.body.message : 'Something went wrong in the browser. Reload the page and try again.';
  return (
    <Alert.Root status="error" role="alert">
      <Alert.Indicator />
      <Alert.Content>
        <Alert.Title>{title}</Alert.Title>
        <Alert.Description>{message}</Alert.Description>
      </Alert.Content>
      {onRetry && (
        <Button size="sm" variant="outline" colorPalette="red" alignSelf="center" onClick={onRetry}>
          Try again
        </Button>
      )}
    </Alert.Root>
  );
}
