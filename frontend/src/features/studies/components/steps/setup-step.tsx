import { formatDateTime } from '@meritline/shared';
import { Badge, Box, DataList, Field, Heading, HStack, Input, Link, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router';
import { ValidationError } from 'yup';
import { useSession } from '@/lib/auth';
import { paths } from '@/lib/config/paths';
import { studyDetailsSchema, type StudyDetailsValues } from '../../api/study-details-rules';
import type { StudyDraftController } from '../../hooks/use-study-draft';
import { DeleteDraft } from './delete-draft';

function problemsOf(values: StudyDetailsValues): Partial<Record<keyof StudyDetailsValues, string>> {
  try {
    studyDetailsSchema.validateSync(values, { abortEarly: false });
    return {};
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    return Object.fromEntries(error.inner.map((e) => [e.path, e.message]));
  }
}

/** Step 1 of an existing study: what it validates (fixed) and its bench facts (saved as typed, once valid). */
export function SetupStep({ controller }: { controller: StudyDraftController }) {
  const { draft, server, editable, change } = controller;
  const { user } = useSession();
  const [values, setValues] = useState<StudyDetailsValues>(() => ({
    title: draft.title,
    instrument: draft.meta.instrument ?? '',
    startedOn: draft.meta.startedOn ?? '',
    finishedOn: draft.meta.finishedOn ?? '',
  }));
  const problems = problemsOf(values);

  const edit = (key: keyof StudyDetailsValues, value: string) => {
    const next = { ...values, [key]: value };
    setValues(next);
    const nextProblems = problemsOf(next);
    if (Object.keys(nextProblems).length > 0) return;
    change((d) => ({
      ...d,
      title: next.title.trim(),
      meta: {
        ...d.meta,
        instrument: next.instrument.trim() || undefined,
        startedOn: next.startedOn || undefined,
        finishedOn: next.finishedOn || undefined,
      },
    }));
  };

  const field = (key: keyof StudyDetailsValues, label: string, type: 'text' | 'date' = 'text', required = false) => (
    <Field.Root invalid={Boolean(problems[key])} required={required} readOnly={!editable}>
      <Field.Label>
        {label}
        {required && <Field.RequiredIndicator />}
      </Field.Label>
      <Input type={type} value={values[key]} onChange={(e) => edit(key, e.target.value)} />
      {problems[key] && <Field.ErrorText>{problems[key]}</Field.ErrorText>}
    </Field.Root>
  );

  const { method, methodVersion } = server;
  return (
    <Stack gap="8" maxW="3xl">
      <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p={{ base: '4', md: '6' }}>
        <Stack gap="3">
          <HStack justify="space-between" wrap="wrap">
            <Heading as="h2" size="md">
              What the study validates
            </Heading>
            <Link asChild color="brand.fg" fontSize="sm">
              <RouterLink to={paths.methodDetail.getHref(method.id)}>Open the method</RouterLink>
            </Link>
          </HStack>
          <DataList.Root orientation="horizontal" size="sm">
            <DataList.Item>
              <DataList.ItemLabel>Method</DataList.ItemLabel>
              <DataList.ItemValue>{method.name}</DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Version</DataList.ItemLabel>
              <DataList.ItemValue>
                <HStack gap="2">
                  <Text>Version {methodVersion.number}</Text>
                  <Badge colorPalette={methodVersion.status === 'active' ? 'brand' : methodVersion.status === 'draft' ? 'accent' : 'gray'}>
                    {{ draft: 'Draft', active: 'Active', retired: 'Retired' }[methodVersion.status]}
                  </Badge>
                </HStack>
              </DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Analyte and matrix</DataList.ItemLabel>
              <DataList.ItemValue>
                {method.analyte} in {method.matrix}, {method.technique}
              </DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Units</DataList.ItemLabel>
              <DataList.ItemValue>
                concentration {method.xUnit}, response {method.yUnit}
              </DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Author</DataList.ItemLabel>
              <DataList.ItemValue>
                {server.author.name}, started {formatDateTime(server.createdAt)}
              </DataList.ItemValue>
            </DataList.Item>
          </DataList.Root>
          <Text fontSize="sm" color="fg.muted">
            The method and version are fixed once the study exists; for another version, start a new study.
          </Text>
        </Stack>
      </Box>
      <Stack gap="5">
        {field('title', 'Title', 'text', true)}
        {field('instrument', 'Instrument')}
        <SimpleGrid columns={{ base: 1, sm: 2 }} gap="4">
          {field('startedOn', 'Started on', 'date')}
          {field('finishedOn', 'Finished on', 'date')}
        </SimpleGrid>
      </Stack>
      {server.status === 'draft' && server.author.id === user?.id && <DeleteDraft study={server} />}
    </Stack>
  );
}
