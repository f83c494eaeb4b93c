import { Button, Heading, Stack, Text } from '@chakra-ui/react';
import { FormDialog } from '@/components/form-dialog';
import { TextareaField } from '@/components/form/textarea-field';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import {
  DEFAULT_ACCURACY_BETA,
  DEFAULT_ACCURACY_LAMBDA_PCT,
  DEFAULT_COVERAGE_FACTOR,
  DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT,
  type MethodDto,
  type MethodVersionDto,
} from '@meritline/shared';
import { newVersionFormSchema, useCreateVersion, versionFormSchema, type VersionFormValues } from '../api/create-version';
import { useUpdateVersion } from '../api/update-version';
import { toCriterionRows } from '../api/version-rules';
import { ChangeControlFields } from './change-control-fields';
import { CriteriaEditor } from './criteria-editor';
import { SettingsFields } from './settings-fields';

export interface VersionFormDialogProps {
  method: MethodDto;
  /** `new`: a new draft starting from `version`; `edit`: change the draft `version` itself. */
  mode: 'new' | 'edit';
  version: MethodVersionDto;
  triggerLabel: string;
  /** Analysts propose; quality managers and administrators decide. */
  proposal?: boolean;
}

export function VersionFormDialog({ method, mode, version, triggerLabel, proposal = false }: VersionFormDialogProps) {
  const createVersion = useCreateVersion(method.id);
  const updateVersion = useUpdateVersion(version);
  const nextNumber = Math.max(...method.versions.map((v) => v.number)) + 1;
  const initialValues: VersionFormValues = {
    changeSummary: mode === 'edit' ? version.changeSummary : '',
    changeKind: mode === 'edit' ? (version.changeKind ?? '') : 'other',
    revalidationScope: mode === 'edit' ? (version.revalidationScope ?? []) : [],
    criteria: toCriterionRows(version.criteria),
    settings: {
      requiresQualityRelease: version.settings.requiresQualityRelease,
      checkTolerancePct: version.settings.checkTolerancePct,
      onePointMaxInterceptPct: version.settings.onePointMaxInterceptPct,
      accuracyBeta: version.settings.accuracyBeta ?? DEFAULT_ACCURACY_BETA,
      accuracyLambdaPct: version.settings.accuracyLambdaPct ?? DEFAULT_ACCURACY_LAMBDA_PCT,
      coverageFactor: version.settings.coverageFactor ?? DEFAULT_COVERAGE_FACTOR,
    },
    recoveryEquivalenceMarginPct: version.settings.recoveryEquivalenceMarginPct ?? DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT,
  };
  const recordsChange = mode === 'new' || version.changeKind !== null;
  const title = mode === 'edit' ? `Edit draft version ${version.number}` : `${proposal ? 'Propose' : 'Create'} version ${nextNumber}`;

  const submit = async (values: VersionFormValues) => {
    try {
      if (mode === 'edit') await updateVersion.mutateAsync(values);
      else await createVersion.mutateAsync(values);
    } catch (error) {
      if (isApiError(error) && error.status === 409) {
        toaster.create({
          type: 'warning',
          title: 'Version not saved',
          description: 'Someone else changed this version, or it is no longer a draft. The page now shows the current state.',
        });
        return;
      }
      throw error;
    }
    toaster.create({ type: 'success', title: mode === 'edit' ? `Version ${version.number} saved` : `Draft version ${nextNumber} created` });
  };

  return (
    <FormDialog
      trigger={
        <Button size="sm" variant={mode === 'edit' ? 'outline' : 'solid'}>
          {triggerLabel}
        </Button>
      }
      title={title}
      description={
        mode === 'new'
          ? `${method.name}. The new version starts as a draft with the criteria and settings of version ${version.number}; ${
              proposal ? 'a quality manager decides whether it becomes active.' : 'activate it when it is ready.'
            }`
          : `${method.name}. Criteria and settings can change only while the version is a draft.`
      }
      size="xl"
      scrollBehavior="inside"
      initialValues={initialValues}
      validationSchema={mode === 'new' ? newVersionFormSchema : versionFormSchema}
      onSubmit={submit}
      submitLabel={mode === 'edit' ? 'Save the draft' : 'Create the draft'}
    >
      <TextareaField name="changeSummary" label="What changes, and why" required rows={2} autoresize />
      <ChangeControlFields recordsChange={recordsChange} />
      <Stack gap="2">
        <Heading as="h3" size="sm">
          Acceptance criteria
        </Heading>
        <Text fontSize="sm" color="fg.muted">
          Each criterion names a figure of the study result and the limit it must meet. The verdict of a study passes only when every
          criterion holds.
        </Text>
        <CriteriaEditor />
      </Stack>
      <Stack gap="2">
        <Heading as="h3" size="sm">
          Settings
        </Heading>
        <SettingsFields />
      </Stack>
    </FormDialog>
  );
}
