import {
  formatLevel,
  DEFAULT_ACCURACY_BETA,
  DEFAULT_ACCURACY_LAMBDA_PCT,
  DEFAULT_COVERAGE_FACTOR,
  formatNumber,
  formatPercent,
} from '@meritline/shared';
import { Alert, Field, Fieldset, Heading, Input, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { SelectControl } from '@/components/select-control';
import { AccuracyProfilePlot, validityWords } from '@/components/study-results';
import { accuracyDesignProblems, accuracyItems, accuracyOptionProblems, type AccuracyOptions } from '../../utils/study-sheets';
import type { DataStepProps } from './calibration-step';
import { FigureLine, LivePanel } from './live-panel';
import { SheetEditor } from './sheet-editor';
import { DataStepLayout, StepSection } from './step-layout';

const BETA_CHOICES = [
  { value: '0.8', label: '80 %' },
  { value: '0.95', label: '95 %' },
];

/** The usual β values, and a study's other value where it has one. */
const betaChoices = (chosen: string) =>
  chosen === '' || BETA_CHOICES.some((c) => c.value === chosen) ? BETA_CHOICES : [...BETA_CHOICES, { value: chosen, label: chosen }];

interface OptionFieldProps {
  name: keyof AccuracyOptions;
  label: string;
  helper: string;
  placeholder?: string;
  problems: Partial<Record<keyof AccuracyOptions, string>>;
  options: AccuracyOptions;
  readOnly: boolean;
  onChange: (name: keyof AccuracyOptions, value: string) => void;
}

function OptionField({ name, label, helper, placeholder, problems, options, readOnly, onChange }: OptionFieldProps) {
  const problem = problems[name];
  return (
    <Field.Root invalid={Boolean(problem)} readOnly={readOnly}>
      <Field.Label>{label}</Field.Label>
      <Input
        value={options[name]}
        inputMode="decimal"
        maxLength={200}
        placeholder={placeholder}
        onChange={(e) => onChange(name, e.target.value)}
      />
      {problem ? <Field.ErrorText>{problem}</Field.ErrorText> : <Field.HelperText>{helper}</Field.HelperText>}
    </Field.Root>
  );
}

/** Accuracy design (level × series × replicate), the reference material and the options of the profile and of U. */
export function AccuracyStep({ controller, live, units }: DataStepProps) {
  const { draft, server, editable, change } = controller;
  const options = draft.data.settings.accuracy;
  const problems = accuracyOptionProblems(options);
  const version = server.methodVersion.settings;
  const versionBeta = version.accuracyBeta ?? DEFAULT_ACCURACY_BETA;
  const versionLambda = version.accuracyLambdaPct ?? DEFAULT_ACCURACY_LAMBDA_PCT;
  const versionK = version.coverageFactor ?? DEFAULT_COVERAGE_FACTOR;
  const setOption = (name: keyof AccuracyOptions, value: string) =>
    change((d) => ({
      ...d,
      data: { ...d.data, settings: { ...d.data.settings, accuracy: { ...d.data.settings.accuracy, [name]: value } } },
    }));
  const fieldProps = { problems, options, readOnly: !editable, onChange: setOption };
  const profile = live.result?.accuracyProfile;
  const uncertainty = live.result?.uncertainty;
  const trueness = live.result?.trueness;
  const designProblems = accuracyDesignProblems(accuracyItems(draft.data.sheets.accuracy));
  const betaChoice = options.beta.trim() === '' ? '' : String(Number(options.beta));

  return (
    <DataStepLayout>
      <Stack gap="8">
        <StepSection
          title="Accuracy and uncertainty"
          intro="Samples of known content measured at several levels, in several series (days, analysts or instruments), each series with the same number of replicates: at least 3 levels, 2 series per level and 2 replicates per series. The accuracy profile and the measurement uncertainty come from these results."
        >
          <SheetEditor controller={controller} section="accuracy" sectionName="accuracy results" units={units} />
          {designProblems.length > 0 && (
            <Alert.Root status="warning" data-testid="accuracy-design-problems">
              <Alert.Indicator />
              <Alert.Content>
                <Alert.Title>Nothing is saved until the accuracy design is complete</Alert.Title>
                {designProblems.slice(0, 5).map((problem) => (
                  <Alert.Description key={problem}>{problem}.</Alert.Description>
                ))}
                <Alert.Description>
                  Until then your changes stay in this window and the saved study keeps its last complete design.
                </Alert.Description>
              </Alert.Content>
            </Alert.Root>
          )}
        </StepSection>

        <Fieldset.Root disabled={!editable}>
          <Fieldset.Legend>
            <Heading as="h3" size="md">
              Options of the accuracy profile and of the uncertainty
            </Heading>
          </Fieldset.Legend>
          <Fieldset.HelperText>Left empty, the method version’s setting applies.</Fieldset.HelperText>
          <SimpleGrid columns={{ base: 1, md: 2 }} gap="4" mt="2">
            <Field.Root readOnly={!editable}>
              <Field.Label>β, expected proportion of results inside the tolerance limits</Field.Label>
              <SelectControl
                value={betaChoice}
                onChange={(value) => setOption('beta', value)}
                placeholder={`Method version’s (${formatPercent(versionBeta * 100, 3)})`}
                options={betaChoices(betaChoice)}
              />
              <Field.HelperText>80 % is usual; 95 % is the stricter choice.</Field.HelperText>
            </Field.Root>
            <OptionField
              name="lambda"
              label="Acceptance limits ±λ (%)"
              placeholder={`${formatNumber(versionLambda, 3)} (method version’s)`}
              helper="The largest total error the method may show, e.g. 10 % for an assay, 15 % or more at trace level."
              {...fieldProps}
            />
            <OptionField
              name="coverageFactor"
              label="Coverage factor k"
              placeholder={`${formatNumber(versionK, 3)} (method version’s)`}
              helper="U = k · uc; k = 2 gives about 95 % coverage."
              {...fieldProps}
            />
            <OptionField
              name="relativeAbove"
              label={`State U relative from (${units.x})`}
              placeholder="Always relative"
              helper="Below this concentration U is stated in concentration units, from it on in %."
              {...fieldProps}
            />
            <OptionField
              name="uReferencePct"
              label="Relative standard uncertainty of the nominal values (%)"
              placeholder="0"
              helper="From the preparation of the spiked or reference samples; it enters u(bias)."
              {...fieldProps}
            />
          </SimpleGrid>
        </Fieldset.Root>

        <Fieldset.Root disabled={!editable}>
          <Fieldset.Legend>
            <Heading as="h3" size="md">
              Reference material (optional)
            </Heading>
          </Fieldset.Legend>
          <Fieldset.HelperText>
            A certified reference material measured several times: its certificate value and the standard uncertainty of that value (the
            certificate’s U divided by its k). Saved once all three are filled in.
          </Fieldset.HelperText>
          <SimpleGrid columns={{ base: 1, md: 2 }} gap="4" mt="2">
            <OptionField name="certified" label={`Certified value (${units.x})`} helper="As printed on the certificate." {...fieldProps} />
            <OptionField
              name="uCertified"
              label={`Standard uncertainty of the certified value (${units.x})`}
              helper="Certificate U / k, e.g. 0.10 / 2 = 0.05."
              {...fieldProps}
            />
          </SimpleGrid>
          <OptionField
            name="referenceResults"
            label={`Results found on the reference material (${units.x})`}
            placeholder="5.12; 5.18; 5.09"
            helper="At least two, separated by semicolons or spaces."
            {...fieldProps}
          />
        </Fieldset.Root>
      </Stack>

      <LivePanel title="Accuracy and uncertainty as you type" live={live}>
        {profile ? (
          <Stack gap="2">
            <Text fontSize="sm">
              Valid <Text as="strong">{validityWords(profile, units.x)}</Text> (β = {formatLevel(profile.beta * 100)} %, λ = ±
              {formatLevel(profile.lambda)} %).
            </Text>
            <AccuracyProfilePlot result={live.result!} units={units} height={260} />
          </Stack>
        ) : (
          <Text fontSize="sm" color="fg.muted">
            The accuracy profile needs at least 3 levels, each with 2 series of the same number (2 or more) of replicates.
          </Text>
        )}
        {uncertainty && (
          <Stack gap="0">
            {uncertainty.byLevel.map((l) => (
              <FigureLine
                key={l.level}
                label={`U at level ${l.level} (k = ${formatLevel(uncertainty.coverageFactor)})`}
                value={l.expressedAs === 'relative' ? formatPercent(l.UPct, 3) : `${formatNumber(l.U, 3)} ${units.x}`}
              />
            ))}
          </Stack>
        )}
        {trueness && (
          <FigureLine
            label="Reference material: difference (U of the difference)"
            value={`${formatNumber(trueness.difference, 3)} (${formatNumber(trueness.UDifference, 3)}) ${units.x}`}
          />
        )}
      </LivePanel>
    </DataStepLayout>
  );
}
