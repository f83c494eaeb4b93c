import { Badge, Box, Button, CloseButton, Field, Heading, HStack, Input, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { AUDIT_ACTION_LABELS, AUDIT_RECORD_KIND_LABELS, hasAnyRole, Role, type AuditRecordKind } from '@meritline/shared';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useSearchParams } from 'react-router';
import { DataTable } from '@/components/data-table';
import { PageHeader } from '@/components/page-header';
import { SelectControl } from '@/components/select-control';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import { useSession } from '@/lib/auth';
import { changeSearch } from '@/lib/search-params';
import { AUDIT_PAGE_SIZE, auditQueries, downloadAuditExtract, type AuditFilters } from '../api/audit-queries';
import { auditColumns } from '../components/audit-columns';
import { ChainCheck } from '../components/chain-check';
import { LatestReview, ReviewPanel } from '../components/review-panel';

const ACTION_CHOICES = Object.entries(AUDIT_ACTION_LABELS)
  .sort(([, a], [, b]) => a.localeCompare(b))
  .map(([value, label]) => ({ value, label }));
const FILTER_KEYS = ['record', 'user', 'action', 'from', 'to', 'q'] as const;

export default function AuditTrailPage() {
  const { user } = useSession();
  const [params, setParams] = useSearchParams();
  const filters: AuditFilters = Object.fromEntries(FILTER_KEYS.map((key) => [key, params.get(key) ?? undefined]));
  const filterKey = FILTER_KEYS.map((key) => params.get(key) ?? '').join('|');
  // Keyset paging: the cursors of the pages already seen, so "Newer" can step back.
  const [paging, setPaging] = useState<{ filterKey: string; cursors: number[] }>({ filterKey, cursors: [] });
  const cursors = paging.filterKey === filterKey ? paging.cursors : [];
  const setCursors = (next: number[]) => setPaging({ filterKey, cursors: next });
  const cursor = cursors[cursors.length - 1];
  const page = useQuery(auditQueries.page(filters, cursor));
  const people = useQuery(auditQueries.people());
  const reviews = useQuery(auditQueries.reviews());
  const [text, setText] = useState(filters.q ?? '');
  const [busy, setBusy] = useState<'csv' | 'pdf' | null>(null);

  const oversight = !!user && hasAnyRole(user.roles, [Role.QualityManager, Role.Admin]);
  const qualityManager = !!user && user.roles.includes(Role.QualityManager);
  const update = (changes: Partial<Record<(typeof FILTER_KEYS)[number], string>>) => setParams((current) => changeSearch(current, changes));
  const download = async (format: 'csv' | 'pdf') => {
    setBusy(format);
    try {
      await downloadAuditExtract(filters, format);
    } catch (error) {
      toaster.create({ type: 'error', title: 'The export failed', description: isApiError(error) ? error.message : String(error) });
    } finally {
      setBusy(null);
    }
  };

  const record = page.data?.record ?? null;
  const recordName = record ? `${AUDIT_RECORD_KIND_LABELS[record.kind as AuditRecordKind]} “${record.name}”` : null;
  const total = page.data?.total ?? 0;
  const first = cursors.length * AUDIT_PAGE_SIZE + 1;
  const shown = page.data?.items.length ?? 0;

  return (
    <>
      <PageHeader
        section="Quality"
        title="Audit trail"
        description={
          oversight
            ? 'Who did what and when, with the values before and after and the reason given. Entries cannot be changed or deleted; the chain check shows whether any was.'
            : 'The trail of the records you work on: who did what and when, with the values before and after.'
        }
        actions={
          <HStack gap="3">
            <Button variant="outline" loading={busy === 'csv'} onClick={() => void download('csv')}>
              Export CSV
            </Button>
            <Button variant="outline" loading={busy === 'pdf'} onClick={() => void download('pdf')}>
              Export signed PDF
            </Button>
          </HStack>
        }
      />
      <Stack gap="6">
        {oversight && (
          <SimpleGrid columns={{ base: 1, lg: 2 }} gap="4">
            <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p="5">
              <Heading as="h2" size="sm" mb="3">
                Integrity of the trail
              </Heading>
              <ChainCheck />
            </Box>
            <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p="5">
              <Heading as="h2" size="sm" mb="3">
                Review of the trail
              </Heading>
              <Stack gap="3">
                <LatestReview review={reviews.data?.[0]} />
                {qualityManager && <ReviewPanel filters={filters} recordName={recordName} />}
              </Stack>
            </Box>
          </SimpleGrid>
        )}

        <Stack gap="3" as="section" aria-label="Filters">
          {filters.record && (
            <HStack gap="2">
              <Badge size="lg" colorPalette="brand" variant="surface" data-testid="record-filter">
                {recordName ?? 'One record'}
              </Badge>
              <CloseButton size="xs" aria-label="Show every record" onClick={() => update({ record: '' })} />
            </HStack>
          )}
          <HStack gap="4" align="flex-end" wrap="wrap">
            <Field.Root maxW="3xs">
              <Field.Label>Person</Field.Label>
              <SelectControl
                value={filters.user ?? ''}
                onChange={(user) => update({ user })}
                placeholder="Everyone"
                options={(people.data ?? []).map((person) => ({ value: person.id, label: person.name }))}
              />
            </Field.Root>
            <Field.Root maxW="xs">
              <Field.Label>Action</Field.Label>
              <SelectControl
                value={filters.action ?? ''}
                onChange={(action) => update({ action })}
                placeholder="Every action"
                options={ACTION_CHOICES}
              />
            </Field.Root>
            <Field.Root maxW="44">
              <Field.Label>First day</Field.Label>
              <Input type="date" value={filters.from ?? ''} max={filters.to} onChange={(e) => update({ from: e.currentTarget.value })} />
            </Field.Root>
            <Field.Root maxW="44">
              <Field.Label>Last day</Field.Label>
              <Input type="date" value={filters.to ?? ''} min={filters.from} onChange={(e) => update({ to: e.currentTarget.value })} />
            </Field.Root>
            <form
              onSubmit={(event) => {
                event.preventDefault();
                update({ q: text.trim() });
              }}
            >
              <Field.Root minW="sm">
                <Field.Label>Words</Field.Label>
                <HStack gap="2">
                  <Input
                    width="xs"
                    value={text}
                    maxLength={100}
                    placeholder="Name, action, reason, value"
                    onChange={(e) => setText(e.currentTarget.value)}
                  />
                  <Button type="submit" variant="outline">
                    Search
                  </Button>
                </HStack>
              </Field.Root>
            </form>
          </HStack>
          <Text fontSize="sm" color="fg.muted">
            Days are calendar days in UTC; times below are shown in your browser&apos;s time zone.
          </Text>
        </Stack>

        <DataTable
          label="Audit trail"
          columns={auditColumns}
          query={page}
          data={page.data?.items}
          getRowId={(entry) => String(entry.seq)}
          emptyTitle="No entries"
          emptyDescription="Nothing in the trail matches these filters."
        />
        {total > 0 && (
          <HStack justify="space-between">
            <Text fontSize="sm" color="fg.muted" data-testid="audit-range">
              Entries {first}–{first + shown - 1} of {page.data?.totalIsCapped ? `more than ${total}` : total}, newest first
            </Text>
            <HStack gap="2">
              <Button size="sm" variant="outline" disabled={!cursors.length} onClick={() => setCursors(cursors.slice(0, -1))}>
                Newer
              </Button>
              <Button
                size="sm"
                variant="outline"
                disabled={!page.data?.nextCursor}
                onClick={() => page.data?.nextCursor && setCursors([...cursors, page.data.nextCursor])}
              >
                Older
              </Button>
            </HStack>
          </HStack>
        )}
      </Stack>
    </>
  );
}
