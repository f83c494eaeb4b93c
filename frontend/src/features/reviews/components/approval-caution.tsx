import { Alert } from '@chakra-ui/react';

export const APPROVAL_CAUTION =
  'Approval in Meritline supports, and does not replace, the laboratory’s own procedures, qualified review and the regulations that apply, above all for results on drinking water and released products.';

export const FAILED_VERDICT_CAUTION =
  'Approving it lets routine batches use the method version all the same. Write why the failed criteria do not matter for the intended use; your justification is printed with your signature in the report and kept in the review history.';

export function ApprovalCaution() {
  return (
    <Alert.Root status="neutral" variant="outline" size="sm">
      <Alert.Indicator />
      <Alert.Content>
        <Alert.Description>{APPROVAL_CAUTION}</Alert.Description>
      </Alert.Content>
    </Alert.Root>
  );
}
