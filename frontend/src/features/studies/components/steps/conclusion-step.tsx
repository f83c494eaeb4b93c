import { Alert, Field, Heading, Stack, Text, Textarea } from '@chakra-ui/react';
import { VerdictSummary } from '@/components/study-results';
import type { SubmitSlot } from '../../api/types';
import type { DataStepProps } from './calibration-step';

const MAX_CONCLUSION = 4000;

export function ConclusionStep({ controller, live, criteria, SubmitSlot }: DataStepProps & { SubmitSlot: SubmitSlot }) {
  const { draft, server, editable, change, state } = controller;
  const conclusion = draft.meta.conclusion ?? '';
  return (
    <Stack gap="8" maxW="5xl">
      <Stack gap="3">
        <Heading as="h2" size="lg">
          Verdict
        </Heading>
        {live.result ? (
          <VerdictSummary result={live.result} criteria={criteria} />
        ) : (
          <Text color="fg.muted">No verdict yet: the study data are not complete enough to evaluate.</Text>
        )}
      </Stack>
      <Field.Root readOnly={!editable} invalid={conclusion.length > MAX_CONCLUSION}>
        <Field.Label fontSize="md">Your conclusion</Field.Label>
        <Textarea
          value={conclusion}
          rows={7}
          autoresize
          maxLength={MAX_CONCLUSION}
          placeholder="Is the method fit for its purpose over the range studied? Note any limits of use, excluded points and their causes, and follow-up actions."
          onChange={(e) => change((d) => ({ ...d, meta: { ...d.meta, conclusion: e.target.value || undefined } }))}
        />
        <Field.HelperText>
          Saved with the study and shown to the reviewer. {conclusion.length} of {MAX_CONCLUSION} characters.
        </Field.HelperText>
        {conclusion.length > MAX_CONCLUSION && (
          <Field.ErrorText>Shorten the conclusion to at most {MAX_CONCLUSION} characters.</Field.ErrorText>
        )}
      </Field.Root>
      <Alert.Root status="warning" variant="subtle">
        <Alert.Indicator />
        <Alert.Content>
          <Alert.Title>Before results are used</Alert.Title>
          <Alert.Description>
            Meritline computes the figures of merit from the data entered, by the formulas of the standards it names. A study supports, and
            does not replace, your laboratory's procedures, a qualified second person's review and the regulations that apply to the
            results, above all where they bear on public health, such as drinking water, or on the release of products.
          </Alert.Description>
        </Alert.Content>
      </Alert.Root>
      {state.kind === 'saved' || !editable ? (
        <SubmitSlot study={server} />
      ) : (
        <Text color="fg.muted" role="status">
          Submitting becomes possible once every change is saved.
        </Text>
      )}
    </Stack>
  );
}
