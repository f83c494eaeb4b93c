import { Alert } from '@chakra-ui/react';

export const APPROVAL_CAUTION =
  'Approval in Meritline supports, and does not replace, the laboratory’s own procedures, qualified review and the regulations that apply, above all for results on drinking water and released products.';

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
