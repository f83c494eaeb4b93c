import { Box, Button, Fieldset, Heading, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { MASS_UNITS, MAX_DILUTION_STEPS, TOLERANCE_DISTRIBUTION_LABELS, type ReferenceMaterialDto } from '@meritline/shared';
import { FieldArray, useFormikContext } from 'formik';
import { FormField } from '@/components/form/form-field';
import { SelectField } from '@/components/form/select-field';
import { newStep, type PreparationValues } from '../api/preparation-form';
import { certifiedValueWords } from './certified-value';

const DISTRIBUTIONS = Object.entries(TOLERANCE_DISTRIBUTION_LABELS).map(([value, label]) => ({ value, label }));

export function MaterialField({ materials }: { materials: readonly ReferenceMaterialDto[] }) {
  const { values } = useFormikContext<PreparationValues>();
  const chosen = materials.find((m) => m.id === values.materialId);
  return (
    <SelectField
      name="materialId"
      label="Reference material weighed"
      required
      helperText={
        chosen ? `Certified ${certifiedValueWords(chosen)}; use until ${chosen.expiresOn}.` : 'Materials in use, certified for purity.'
      }
      placeholder="Choose a material…"
      options={materials.map((m) => ({ value: m.id, label: `${m.name}, lot ${m.lot}` }))}
    />
  );
}

export function StockFields() {
  const { values } = useFormikContext<PreparationValues>();
  const unit = values.stock.massUnit;
  return (
    <Fieldset.Root>
      <Fieldset.Legend>
        <Heading as="h2" size="md">
          Stock solution
        </Heading>
      </Fieldset.Legend>
      <Stack gap="4" mt="2">
        <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
          <FormField name="stock.mass" label={`Mass weighed (${unit})`} required type="number" />
          <FormField
            name="stock.uMass"
            label={`u of the mass (${unit})`}
            required
            type="number"
            helperText="From the balance calibration."
          />
          <SelectField name="stock.massUnit" label="Mass unit" options={MASS_UNITS.map((u) => ({ value: u, label: u }))} />
        </SimpleGrid>
        <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
          <FormField name="stock.volume" label="Volume of the flask (mL)" required type="number" />
          <FormField name="stock.volumeTolerance" label="Flask tolerance ± (mL)" required type="number" />
          <SelectField name="stock.volumeDistribution" label="Tolerance taken as" options={DISTRIBUTIONS} />
        </SimpleGrid>
        <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
          <FormField
            name="stock.volumeRepeatability"
            label="Filling SD (mL)"
            type="number"
            helperText="Optional; from fill-and-weigh checks."
          />
          <FormField
            name="stock.temperatureRange"
            label="Temperature ± (°C)"
            type="number"
            helperText="Optional; deviation from the flask’s calibration temperature."
          />
          <FormField
            name="stock.expansionCoefficient"
            label="Expansion per °C"
            type="number"
            placeholder="0.00021"
            helperText="Water (0.00021) when left empty."
          />
        </SimpleGrid>
      </Stack>
    </Fieldset.Root>
  );
}

export function StepFields() {
  const { values } = useFormikContext<PreparationValues>();
  return (
    <FieldArray name="steps">
      {({ push, remove }) => (
        <Stack gap="4">
          <HStack justify="space-between">
            <Heading as="h2" size="md">
              Dilutions
            </Heading>
            <Button size="sm" variant="outline" disabled={values.steps.length >= MAX_DILUTION_STEPS} onClick={() => push(newStep())}>
              Add a dilution
            </Button>
          </HStack>
          {values.steps.length === 0 && <Text color="fg.muted">No dilution: only the stock is prepared.</Text>}
          {values.steps.map((_, i) => (
            <Box key={i} borderWidth="1px" borderRadius="l2" p="4" bg="bg.panel" role="group" aria-label={`Dilution ${i + 1}`}>
              <HStack justify="space-between" mb="3">
                <Text fontWeight="600">
                  Dilution {i + 1}: from {i === 0 ? 'the stock' : `dilution ${i}`}
                </Text>
                <Button size="xs" variant="ghost" colorPalette="red" onClick={() => remove(i)} aria-label={`Remove dilution ${i + 1}`}>
                  Remove
                </Button>
              </HStack>
              <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
                <FormField name={`steps.${i}.aliquot`} label="Aliquot (mL)" required type="number" />
                <FormField name={`steps.${i}.aliquotTolerance`} label="Pipette tolerance ± (mL)" required type="number" />
                <SelectField name={`steps.${i}.aliquotDistribution`} label="Tolerance taken as" options={DISTRIBUTIONS} />
                <FormField name={`steps.${i}.volume`} label="Final volume (mL)" required type="number" />
                <FormField name={`steps.${i}.volumeTolerance`} label="Flask tolerance ± (mL)" required type="number" />
                <SelectField name={`steps.${i}.volumeDistribution`} label="Tolerance taken as" options={DISTRIBUTIONS} />
              </SimpleGrid>
            </Box>
          ))}
        </Stack>
      )}
    </FieldArray>
  );
}
