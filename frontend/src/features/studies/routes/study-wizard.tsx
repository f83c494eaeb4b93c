import { type StudyDto, withVersionOptions } from '@meritline/shared';
import { Alert, Button, Field, HStack, Input, Link, Stack } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { useEffect, useMemo } from 'react';
import { Link as RouterLink, useParams, useSearchParams } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { PageSpinner } from '@/components/page-spinner';
import { preloadPlotly } from '@/components/study-results';
import { QueryError } from '@/components/query-error';
import { paths } from '@/lib/config/paths';
import { studiesQueries } from '../api/studies-queries';
import type { RemarksSlot, SubmitSlot } from '../api/types';
import { AccuracyStep } from '../components/steps/accuracy-step';
import { BlanksStep } from '../components/steps/blanks-step';
import { CalibrationStep, type DataStepProps } from '../components/steps/calibration-step';
import { ConclusionStep } from '../components/steps/conclusion-step';
import { PrecisionStep } from '../components/steps/precision-step';
import { RecoveryStep } from '../components/steps/recovery-step';
import { ResultsStep } from '../components/steps/results-step';
import { SetupStep } from '../components/steps/setup-step';
import { StudyStatusBadge } from '../components/study-status-badge';
import { SaveStatus } from '../components/wizard/save-status';
import { StudyStepper } from '../components/wizard/study-stepper';
import { clampStep, LAST_STEP, WIZARD_STEPS } from '../components/wizard/wizard-steps';
import { useLiveEvaluation } from '../hooks/use-live-evaluation';
import { useStudyDraft, type StudyDraftController } from '../hooks/use-study-draft';
import { countSkippedRows } from '../utils/study-sheets';

const rowsNote = (count: number, skipped: number) =>
  count === 0 ? 'No rows yet' : `${count} row${count === 1 ? '' : 's'}${skipped ? `, ${skipped} to correct` : ''}`;

function stepNotes(controller: StudyDraftController, verdict: boolean | null | undefined): Record<number, string> {
  const { sheets } = controller.draft.data;
  const note = (section: keyof typeof sheets) => rowsNote(sheets[section].length, countSkippedRows(section, sheets[section]));
  return {
    2: note('standards'),
    3: `${note('blanks')}`,
    4: note('recovery'),
    5: note('precision'),
    6: note('accuracy'),
    7: verdict === true ? 'Meets the criteria' : verdict === false ? 'Does not meet all criteria' : 'Figures, plots, flags',
  };
}

function SaveProblems({ controller }: { controller: StudyDraftController }) {
  const { state, reload, saveNow } = controller;
  if (state.kind === 'conflict') {
    return (
      <Alert.Root status="error" role="alert">
        <Alert.Indicator />
        <Alert.Content>
          <Alert.Title>Someone else saved this study while you were editing</Alert.Title>
          <Alert.Description>
            Your latest changes are not saved, so that theirs are not overwritten. Reload to see the study as it is now, then make your
            changes again.
          </Alert.Description>
        </Alert.Content>
        <Button size="sm" alignSelf="center" onClick={() => void reload()}>
          Reload the study
        </Button>
      </Alert.Root>
    );
  }
  if (state.kind === 'error') {
    return (
      <Alert.Root status="error" role="alert">
        <Alert.Indicator />
        <Alert.Content>
          <Alert.Title>The last change was not saved: {state.message}</Alert.Title>
          {state.details.map((detail, i) => (
            <Alert.Description key={i}>{detail}</Alert.Description>
          ))}
        </Alert.Content>
        <Button size="sm" variant="outline" alignSelf="center" onClick={() => void saveNow()}>
          Try again
        </Button>
      </Alert.Root>
    );
  }
  return null;
}

interface Slots {
  SubmitSlot: SubmitSlot;
  RemarksSlot: RemarksSlot;
}

function StudyWizard({ study, step, SubmitSlot, RemarksSlot }: { study: StudyDto; step: number } & Slots) {
  const controller = useStudyDraft(study);
  // The browser applies the version's β, λ and k as the server does, so both show the same figures.
  const settings = controller.server.methodVersion.settings;
  const liveData = useMemo(() => withVersionOptions(controller.data, settings), [controller.data, settings]);
  const live = useLiveEvaluation(liveData);
  const { draft, server, state, editable, lockedReason, reason, setReason } = controller;
  const units = { x: server.method.xUnit, y: server.method.yUnit };
  const props: DataStepProps = { controller, live, units, criteria: server.methodVersion.criteria };
  const current = WIZARD_STEPS[step - 1];
  // Plotly is large: fetch it while the analyst is still typing, so the first plot appears at once.
  useEffect(preloadPlotly, []);

  return (
    <>
      <Link asChild fontSize="sm" color="fg.muted" mb="3">
        <RouterLink to={paths.studies.getHref()}>← All studies</RouterLink>
      </Link>
      <PageHeader
        section={`Validation study · step ${step} of ${LAST_STEP}: ${current.title}`}
        title={draft.title || 'Untitled study'}
        description={`${server.method.name}, version ${server.methodVersion.number}`}
        actions={
          <HStack gap="4" wrap="wrap">
            <StudyStatusBadge status={server.status} />
            <SaveStatus state={state} editable={editable} onRetry={() => void controller.saveNow()} />
          </HStack>
        }
      />
      <StudyStepper studyId={server.id} current={step} notes={stepNotes(controller, live.result?.verdict.pass)} />
      <Stack gap="6">
        {lockedReason && (
          <Alert.Root status="info" data-testid="read-only-reason">
            <Alert.Indicator />
            <Alert.Description>
              {lockedReason} What you see is the record; its signatures and comments are on the{' '}
              <Link asChild color="brand.fg">
                <RouterLink to={paths.studyView.getHref(server.id)}>review page</RouterLink>
              </Link>
              .
            </Alert.Description>
          </Alert.Root>
        )}
        {server.status === 'returned' && (
          <Alert.Root status="warning" alignItems="flex-start">
            <Alert.Indicator />
            <Alert.Content gap="3" minW="0">
              <Alert.Title>The reviewer returned this study</Alert.Title>
              <RemarksSlot studyId={server.id} />
              {editable && (
                <Field.Root required invalid={state.kind === 'needs-reason'}>
                  <Field.Label>
                    Why the study changes now (kept with each change on record; every change needs it)
                    <Field.RequiredIndicator />
                  </Field.Label>
                  <Input value={reason} onChange={(e) => setReason(e.target.value)} bg="bg.panel" maxLength={500} />
                  {state.kind === 'needs-reason' && (
                    <Field.ErrorText>Your change is not saved yet: say why the study changes, then it is saved.</Field.ErrorText>
                  )}
                </Field.Root>
              )}
            </Alert.Content>
          </Alert.Root>
        )}
        <SaveProblems controller={controller} />
        {step === 1 && <SetupStep controller={controller} />}
        {step === 2 && <CalibrationStep {...props} />}
        {step === 3 && <BlanksStep {...props} />}
        {step === 4 && <RecoveryStep {...props} />}
        {step === 5 && <PrecisionStep {...props} />}
        {step === 6 && <AccuracyStep {...props} />}
        {step === 7 && <ResultsStep {...props} />}
        {step === 8 && <ConclusionStep {...props} SubmitSlot={SubmitSlot} />}
        <HStack justify="space-between" pt="6" borderTopWidth="1px" borderColor="border">
          {step > 1 ? (
            <Button asChild variant="outline">
              <RouterLink to={paths.studyEdit.getHref(server.id, step - 1)}>← {WIZARD_STEPS[step - 2].title}</RouterLink>
            </Button>
          ) : (
            <span />
          )}
          {step < LAST_STEP && (
            <Button asChild>
              <RouterLink to={paths.studyEdit.getHref(server.id, step + 1)}>{WIZARD_STEPS[step].title} →</RouterLink>
            </Button>
          )}
        </HStack>
      </Stack>
    </>
  );
}

/** The app composes the page with the review feature's submit step (features never import each other). */
export function StudyWizardPage({ SubmitSlot, RemarksSlot }: Slots) {
  const { studyId = '' } = useParams();
  const [search] = useSearchParams();
  const study = useQuery(studiesQueries.detail(studyId));
  const step = clampStep(search.get('step'));

  if (study.isPending) return <PageSpinner label="Opening the study" />;
  if (study.isError) return <QueryError error={study.error} title="The study could not be opened" onRetry={() => void study.refetch()} />;
  return <StudyWizard key={study.data.id} study={study.data} step={step} SubmitSlot={SubmitSlot} RemarksSlot={RemarksSlot} />;
}
