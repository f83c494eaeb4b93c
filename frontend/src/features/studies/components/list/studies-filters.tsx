import { Button, Checkbox, Field, HStack, Input, Wrap } from '@chakra-ui/react';
import type { StudyStatus, MethodDto } from '@meritline/shared';
import { useEffect, useState } from 'react';
import { SelectControl } from '@/components/select-control';
import { STUDY_STATUS_WORDS } from '../study-status-badge';

export interface StudyFilters {
  status?: StudyStatus;
  methodId?: string;
  mine: boolean;
  from?: string;
  to?: string;
  q?: string;
}

export interface StudiesFiltersProps {
  filters: StudyFilters;
  methods: readonly MethodDto[];
  onChange: (filters: StudyFilters) => void;
}

/** Status, method, mine, a date range on the last change and the title: each narrows the list on the server. */
export function StudiesFilters({ filters, methods, onChange }: StudiesFiltersProps) {
  const [q, setQ] = useState(filters.q ?? '');
  useEffect(() => {
    if ((filters.q ?? '') === q.trim()) return;
    const timer = setTimeout(() => onChange({ ...filters, q: q.trim() || undefined }), 350);
    return () => clearTimeout(timer);
  }, [q, filters, onChange]);

  const active = Boolean(filters.status || filters.methodId || filters.mine || filters.from || filters.to || filters.q);
  return (
    <Wrap
      gap="4"
      align="flex-end"
      borderWidth="1px"
      borderColor="border"
      borderRadius="l3"
      bg="bg.panel"
      p="4"
      role="search"
      aria-label="Filter the studies"
    >
      <Field.Root maxW="18rem">
        <Field.Label>Title contains</Field.Label>
        <Input value={q} onChange={(e) => setQ(e.target.value)} placeholder="e.g. nitrate" type="search" />
      </Field.Root>
      <Field.Root maxW="14rem">
        <Field.Label>Status</Field.Label>
        <SelectControl
          value={filters.status ?? ''}
          onChange={(value) => onChange({ ...filters, status: (value || undefined) as StudyStatus | undefined })}
          placeholder="Any status"
          options={Object.entries(STUDY_STATUS_WORDS).map(([status, words]) => ({ value: status, label: words.label }))}
        />
      </Field.Root>
      <Field.Root maxW="20rem">
        <Field.Label>Method</Field.Label>
        <SelectControl
          value={filters.methodId ?? ''}
          onChange={(value) => onChange({ ...filters, methodId: value || undefined })}
          placeholder="Any method"
          options={methods.map((m) => ({ value: m.id, label: m.name }))}
        />
      </Field.Root>
      <HStack gap="2" align="flex-end">
        <Field.Root maxW="11rem">
          <Field.Label>Changed from</Field.Label>
          <Input type="date" value={filters.from ?? ''} onChange={(e) => onChange({ ...filters, from: e.target.value || undefined })} />
        </Field.Root>
        <Field.Root maxW="11rem">
          <Field.Label>to</Field.Label>
          <Input type="date" value={filters.to ?? ''} onChange={(e) => onChange({ ...filters, to: e.target.value || undefined })} />
        </Field.Root>
      </HStack>
      <Checkbox.Root checked={filters.mine} onCheckedChange={(e) => onChange({ ...filters, mine: e.checked === true })} pb="2">
        <Checkbox.HiddenInput />
        <Checkbox.Control />
        <Checkbox.Label>Only my studies</Checkbox.Label>
      </Checkbox.Root>
      {active && (
        <Button
          variant="ghost"
          size="sm"
          mb="1"
          onClick={() => {
            setQ('');
            onChange({ mine: false });
          }}
        >
          Clear the filters
        </Button>
      )}
    </Wrap>
  );
}
