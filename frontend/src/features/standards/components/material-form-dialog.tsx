import { Button, Input, SimpleGrid } from '@chakra-ui/react';
import { CERTIFIED_VALUE_KIND_LABELS, type ReferenceMaterialDto } from '@meritline/shared';
import { useFormikContext } from 'formik';
import { FormDialog } from '@/components/form-dialog';
import { FormField } from '@/components/form/form-field';
import { SelectField } from '@/components/form/select-field';
import { toaster } from '@/components/ui/toaster';
import {
  emptyMaterial,
  materialSchema,
  materialValues,
  toRequest,
  useSaveReferenceMaterial,
  type MaterialValues,
} from '../api/save-reference-material';

const VALUE_KINDS = Object.entries(CERTIFIED_VALUE_KIND_LABELS).map(([value, label]) => ({ value, label }));
const UNCERTAINTY_FORMS = [
  { value: 'expanded', label: 'An expanded uncertainty U with a coverage factor k' },
  { value: 'standard', label: 'A standard uncertainty u' },
];

function DateField({ name, label, required, helperText }: { name: string; label: string; required?: boolean; helperText?: string }) {
  return (
    <FormField name={name} label={label} required={required} helperText={helperText}>
      {(field) => <Input {...field} value={String(field.value ?? '')} type="date" />}
    </FormField>
  );
}

function CertifiedValueFields() {
  const { values } = useFormikContext<MaterialValues>();
  const purity = values.valueKind === 'purity';
  return (
    <>
      <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
        <SelectField name="valueKind" label="The certificate gives" required options={VALUE_KINDS} />
        {purity ? (
          <FormField
            name="certifiedValue"
            label="Purity (mass fraction, g/g)"
            required
            type="number"
            placeholder="0.9995"
            helperText="99.95 % is 0.9995."
          />
        ) : (
          <SimpleGrid columns={2} gap="3">
            <FormField name="certifiedValue" label="Certified value" required type="number" />
            <FormField name="unit" label="Unit" required placeholder="mg/L" />
          </SimpleGrid>
        )}
      </SimpleGrid>
      <SelectField name="uncertaintyForm" label="The certificate states" required options={UNCERTAINTY_FORMS} />
      {values.uncertaintyForm === 'expanded' ? (
        <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
          <FormField name="expandedUncertainty" label={`Expanded uncertainty U${purity ? ' (g/g)' : ''}`} required type="number" />
          <FormField name="coverageFactor" label="Coverage factor k" required type="number" />
        </SimpleGrid>
      ) : (
        <FormField name="standardUncertainty" label={`Standard uncertainty u${purity ? ' (g/g)' : ''}`} required type="number" />
      )}
    </>
  );
}

export function MaterialFormDialog({ material }: { material?: ReferenceMaterialDto }) {
  const save = useSaveReferenceMaterial();

  return (
    <FormDialog
      trigger={
        material ? (
          <Button size="xs" variant="outline" aria-label={`Edit ${material.name}, lot ${material.lot}`}>
            Edit
          </Button>
        ) : (
          <Button>Register a material</Button>
        )
      }
      title={material ? `Edit ${material.name}` : 'Register a reference material'}
      description="Copy the values from the certificate of analysis. Every change is kept in the audit trail."
      size="lg"
      scrollBehavior="inside"
      initialValues={material ? materialValues(material) : emptyMaterial}
      validationSchema={materialSchema}
      onSubmit={async (values) => {
        const body = toRequest(values);
        const saved = await save.mutateAsync({
          id: material?.id,
          body: material ? { ...body, lockVersion: material.lockVersion } : body,
        });
        toaster.create({ type: 'success', title: material ? `${saved.name} saved` : `${saved.name} registered` });
      }}
      submitLabel={material ? 'Save the changes' : 'Register'}
    >
      <FormField name="name" label="Material" required placeholder="Cadmium granules, 99.99 %" />
      <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
        <FormField name="analyte" label="Analyte" required />
        <FormField name="supplier" label="Supplier" required />
        <FormField name="lot" label="Lot" required />
        <FormField name="certificateNumber" label="Certificate number" required />
      </SimpleGrid>
      <CertifiedValueFields />
      <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
        <DateField name="receivedOn" label="Received" required />
        <DateField name="openedOn" label="Opened" />
        <DateField name="expiresOn" label="Use until" required helperText="The last day it may be used." />
      </SimpleGrid>
      <FormField name="storage" label="Storage" placeholder="Desiccator, room temperature" />
    </FormDialog>
  );
}
