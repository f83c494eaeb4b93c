import {
  evaluateRun,
  formatNumber,
  runContextOf,
  StudyValidationError,
  type CreateRunRequest,
  type FieldError,
  type RunMethodChoiceDto,
  type RunModel,
  type RunOptionsDto,
  type RunPreviewDto,
} from '@meritline/shared';
import { Alert, DataList, Heading, List, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { useFormikContext } from 'formik';
import { useEffect, useMemo } from 'react';
import { FormField } from '@/components/form/form-field';
import { SelectField } from '@/components/form/select-field';
import { buildRunInput, formFieldOf, standardLevels, type RunFormValues } from '../api/create-run';
import { runsQueries } from '../api/runs-queries';
import { useDebouncedValue } from '../hooks/use-debounced-value';
import { parseBlanks, parseChecks, parseQcSamples, parseStandards, parseUnknowns } from '../utils/measurement-text';
import { versionChoices } from '../utils/version-choices';
import { MeasurementField } from './measurement-field';
import { InstrumentImport } from './instrument-import';
import { ModelPicker } from './model-picker';
import { RunResultView } from './run-result-view';

const PREFERRED: RunModel[] = ['linear', 'quadratic', 'two-point', 'one-point'];

function plural(n: number, one: string, many = `${one}s`) {
  return `${n} ${n === 1 ? one : many}`;
}

function ValidationSummary({ options }: { options: RunOptionsDto }) {
  const { validation, method } = options;
  if (!validation) return null;
  return (
    <DataList.Root orientation="horizontal" size="sm" data-testid="validation-summary">
      <DataList.Item>
        <DataList.ItemLabel>Validation study</DataList.ItemLabel>
        <DataList.ItemValue>{validation.studyTitle}</DataList.ItemValue>
      </DataList.Item>
      <DataList.Item>
        <DataList.ItemLabel>LOD and LOQ</DataList.ItemLabel>
        <DataList.ItemValue>
          {formatNumber(options.lod, 3)} and {formatNumber(options.loq, 3)} {method.xUnit} in the measured solution
        </DataList.ItemValue>
      </DataList.Item>
      {options.validatedRange && (
        <DataList.Item>
          <DataList.ItemLabel>Validated range</DataList.ItemLabel>
          <DataList.ItemValue>
            {formatNumber(options.validatedRange.low, 4)} to {formatNumber(options.validatedRange.high, 4)} {method.xUnit}
          </DataList.ItemValue>
        </DataList.Item>
      )}
      <DataList.Item>
        <DataList.ItemLabel>Check standards must recover</DataList.ItemLabel>
        <DataList.ItemValue>
          {100 - options.checkTolerancePct} to {100 + options.checkTolerancePct} % of their nominal value
        </DataList.ItemValue>
      </DataList.Item>
    </DataList.Root>
  );
}

type LocalPreview = { run: RunPreviewDto; errors?: never } | { run?: never; errors: FieldError[] };

/** The run calculated in the browser with the server's own code (shared), so nothing goes over the wire while typing. */
function calculate(input: CreateRunRequest, options: RunOptionsDto): LocalPreview {
  const context = runContextOf(options);
  if (!context) return { errors: [{ field: '', code: 'not_usable', message: options.reason ?? 'This version cannot be used for runs.' }] };
  try {
    // As the server reads it: the data after a JSON round trip.
    return { run: evaluateRun(JSON.parse(JSON.stringify(input.data)), context) };
  } catch (error) {
    if (error instanceof StudyValidationError) return { errors: error.errors };
    return { errors: [{ field: '', code: 'failed', message: error instanceof Error ? error.message : String(error) }] };
  }
}

/** The result for the data as typed, refreshed a moment after the typing stops. */
function RunPreview({ version }: { version: RunOptionsDto }) {
  const { values } = useFormikContext<RunFormValues>();
  const settled = useDebouncedValue(values);
  const preview = useMemo(() => {
    const choice = version.models.find((m) => m.model === settled.model);
    const input = choice?.allowed ? buildRunInput({ ...settled, title: 'Preview' }, choice) : null;
    return input ? calculate(input, version) : null;
  }, [settled, version]);

  let body;
  if (!preview) {
    body = (
      <Text color="fg.muted">
        The preview appears once the method, the calibration, the standards, the check standards and the samples are entered.
      </Text>
    );
  } else if (preview.errors) {
    body = (
      <Alert.Root status="warning" variant="surface">
        <Alert.Indicator />
        <Alert.Content>
          <Alert.Title>The run cannot be calculated from these data yet</Alert.Title>
          <Alert.Description>
            <List.Root ps="4">
              {preview.errors.map((e) => {
                const { row } = formFieldOf(e.field);
                return <List.Item key={e.field + e.message}>{row ? `${row}: ${e.message}` : e.message}</List.Item>;
              })}
            </List.Root>
          </Alert.Description>
        </Alert.Content>
      </Alert.Root>
    );
  } else {
    body = (
      <RunResultView
        preview
        status={preview.run.status}
        result={preview.run.result}
        rejectionReasons={preview.run.rejectionReasons}
        data={preview.run.data}
        units={{ x: version.method.xUnit, y: version.method.yUnit }}
      />
    );
  }
  return (
    <Stack as="section" gap="4" aria-label="Preview" borderTopWidth="1px" borderColor="border" pt="6">
      <Heading as="h2" size="lg">
        Preview
      </Heading>
      <Text color="fg.muted" fontSize="sm">
        Calculated with the same code the server uses when it saves the run; nothing is stored until you save it.
      </Text>
      {body}
    </Stack>
  );
}

/** Method version, calibration and measurements of a new run, with a live preview of its result. */
export function RunFormFields({ methods }: { methods: readonly RunMethodChoiceDto[] }) {
  const { values, setFieldValue } = useFormikContext<RunFormValues>();
  const options = useQuery({ ...runsQueries.options(values.methodVersionId), enabled: values.methodVersionId !== '' });
  const standards = parseStandards(values.standards).rows;
  const levels = standardLevels(standards);
  const checks = parseChecks(values.checks).rows;
  const unknowns = parseUnknowns(values.unknowns).rows;
  const blanks = parseBlanks(values.blanks).rows;
  const qcSamples = parseQcSamples(values.qcSamples).rows;
  const xUnit = options.data?.method.xUnit ?? '';
  const yUnit = options.data?.method.yUnit ?? '';

  // The validated regression is the usual choice; a model the version does not allow is cleared.
  useEffect(() => {
    const models = options.data?.models;
    if (!models) return;
    const current = models.find((m) => m.model === values.model);
    if (current?.allowed) return;
    const preferred = PREFERRED.map((model) => models.find((m) => m.model === model && m.allowed)).find(Boolean);
    void setFieldValue('model', preferred?.model ?? '');
  }, [options.data, values.model, setFieldValue]);

  return (
    <Stack gap="8">
      <SimpleGrid columns={{ base: 1, lg: 2 }} gap="6">
        <SelectField
          name="methodVersionId"
          label="Method version"
          required
          placeholder="Choose a validated method version"
          options={versionChoices(methods, { includeUnusable: false })}
        />
        <FormField name="title" label="Title" required placeholder="e.g. Nitrate in drinking water, batch of 2 December" />
      </SimpleGrid>

      {options.isError && <Text color="fg.error">{options.error.message}</Text>}
      {options.data && (
        <>
          {!options.data.usable && (
            <Alert.Root status="error">
              <Alert.Indicator />
              <Alert.Description>{options.data.reason}</Alert.Description>
            </Alert.Root>
          )}
          <ValidationSummary options={options.data} />
          <Stack as="fieldset" gap="3">
            <Heading as="legend" size="md" mb="3">
              Calibration
            </Heading>
            <FormField name="model" label="How to calibrate" required>
              {() => (
                <ModelPicker
                  choices={options.data.models}
                  value={values.model}
                  onChange={(model) => void setFieldValue('model', model)}
                  bracketing={values.bracketing}
                  onBracketingChange={(on) => void setFieldValue('bracketing', on)}
                  levels={levels}
                  calibrant={values.calibrant}
                  onCalibrantChange={(level) => void setFieldValue('calibrant', level)}
                  unit={xUnit}
                />
              )}
            </FormField>
          </Stack>
        </>
      )}

      {options.data?.usable && <InstrumentImport versionId={values.methodVersionId} />}

      <SimpleGrid columns={{ base: 1, lg: 2 }} gap="6">
        <MeasurementField
          name="standards"
          label="Standards"
          columns={`concentration${xUnit ? ` (${xUnit})` : ''}, response${yUnit ? ` (${yUnit})` : ''}${options.data?.validation?.weighting === '1/s2' ? ', SD of the response' : ''}`}
          example={'0.5\t0.079\n10\t1.527\n50\t7.63'}
          summary={standards.length ? `${plural(standards.length, 'reading')} at ${plural(levels.length, 'level')}` : undefined}
        />
        <MeasurementField
          name="checks"
          label="Check standards"
          columns={`name, nominal concentration${xUnit ? ` (${xUnit})` : ''}, responses`}
          example={'CCV 10 mg/L\t10\t1.526'}
          summary={checks.length ? plural(checks.length, 'check standard') : undefined}
        />
        <MeasurementField
          wide
          name="unknowns"
          label="Samples"
          columns="sample, dilution factor (empty for none), responses"
          example={'W-2811 tap water\t1\t1.83\t1.84\nW-2812 well\t2\t3.95\t3.97'}
          summary={unknowns.length ? plural(unknowns.length, 'sample') : undefined}
        />
        <MeasurementField
          name="blanks"
          optional
          label="Method blanks (optional)"
          columns={`name, limit${xUnit ? ` (${xUnit})` : ''} or empty for the LOD, responses`}
          example={'MB-1\t\t0.004'}
          summary={blanks.length ? plural(blanks.length, 'method blank') : undefined}
        />
        <MeasurementField
          name="qcSamples"
          optional
          label="QC samples of known value (optional)"
          columns={`name, known value${xUnit ? ` (${xUnit})` : ''}, dilution factor (empty for none), responses`}
          example={'QC 20 mg/L\t20\t\t3.05'}
          summary={qcSamples.length ? plural(qcSamples.length, 'QC sample') : undefined}
        />
      </SimpleGrid>

      {options.data?.usable && <RunPreview version={options.data} />}
    </Stack>
  );
}
