import { Alert, Button, Checkbox, Field, HStack, Stack, Text, Textarea } from '@chakra-ui/react';
import { RunReviewStatus, type QcBaselineDto, type QcTrendsDto, formatDateTime } from '@meritline/shared';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { toaster } from '@/components/ui/toaster';
import { api, isApiError } from '@/lib/api-client';
import { runsQueries } from '../api/runs-queries';

/** A quality manager picks the released runs whose values set the control limits of the version; the choice is audited. */
export function BaselinePicker({ chart, onClose }: { chart: QcTrendsDto; onClose: () => void }) {
  const queryClient = useQueryClient();
  const runs = useQuery(runsQueries.list({ methodVersionId: chart.methodVersionId, status: 'accepted', pageSize: 100 }));
  const released = (runs.data?.items ?? []).filter((r) => r.reviewStatus === RunReviewStatus.Released).reverse();
  const [chosen, setChosen] = useState<Set<string>>(new Set(chart.baseline?.runIds ?? []));
  const [reason, setReason] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const save = async () => {
    setBusy(true);
    setProblem(null);
    try {
      await api.put<QcBaselineDto>(`/method-versions/${encodeURIComponent(chart.methodVersionId)}/qc-baseline`, {
        runIds: released.filter((r) => chosen.has(r.id)).map((r) => r.id),
        reason,
        ...(chart.baseline ? { lockVersion: chart.baseline.lockVersion } : {}),
      });
      await queryClient.invalidateQueries({ queryKey: [...runsQueries.all, 'qc-trends'] });
      toaster.create({ type: 'success', title: 'Baseline saved' });
      onClose();
    } catch (error) {
      setProblem(
        isApiError(error) ? (error.body.errors?.map((e) => e.message).join(' ') ?? error.body.message) : 'The baseline could not be saved.',
      );
    } finally {
      setBusy(false);
    }
  };

  return (
    <Stack
      as="section"
      aria-label="Choose the baseline"
      gap="3"
      borderWidth="1px"
      borderColor="border"
      borderRadius="l3"
      p="4"
      bg="bg.panel"
    >
      <Text fontWeight="600">Choose the baseline</Text>
      <Text fontSize="sm" color="fg.muted">
        Released, accepted runs of this version while the method was in control. Their values set the mean and the limits of every series;
        the runs after the last of them are judged. Common practice is 20 or more values; at least 3 are needed.
      </Text>
      {released.length === 0 && !runs.isPending && <Text>No released, accepted run of this version yet.</Text>}
      <Stack gap="1.5" maxH="72" overflowY="auto">
        {released.map((r) => (
          <Checkbox.Root
            key={r.id}
            checked={chosen.has(r.id)}
            onCheckedChange={(e) => {
              const next = new Set(chosen);
              if (e.checked) next.add(r.id);
              else next.delete(r.id);
              setChosen(next);
            }}
          >
            <Checkbox.HiddenInput />
            <Checkbox.Control />
            <Checkbox.Label>
              {r.title} · {formatDateTime(r.createdAt)}
            </Checkbox.Label>
          </Checkbox.Root>
        ))}
      </Stack>
      <Field.Root required>
        <Field.Label>Why these runs</Field.Label>
        <Textarea value={reason} maxLength={500} onChange={(e) => setReason(e.currentTarget.value)} rows={2} />
      </Field.Root>
      {problem && (
        <Alert.Root status="error" variant="surface">
          <Alert.Indicator />
          <Alert.Description>{problem}</Alert.Description>
        </Alert.Root>
      )}
      <HStack>
        <Button size="sm" loading={busy} onClick={() => void save()}>
          Save the baseline ({chosen.size} runs)
        </Button>
        <Button size="sm" variant="ghost" onClick={onClose}>
          Cancel
        </Button>
      </HStack>
    </Stack>
  );
}
