import { Button, FileUpload, GridItem, HStack, Stack, Text, Textarea } from '@chakra-ui/react';
import { useFormikContext } from 'formik';
import { FormField } from '@/components/form/form-field';
import type { RunFormValues } from '../api/create-run';

export interface MeasurementFieldProps {
  name: 'standards' | 'checks' | 'unknowns' | 'blanks' | 'qcSamples';
  label: string;
  /** The columns, in order, as the analyst would type them. */
  columns: string;
  example: string;
  summary?: string;
  /** Spans the whole row of the form grid. */
  wide?: boolean;
  /** May stay empty. */
  optional?: boolean;
}

/** A table typed, pasted from a spreadsheet or read from a CSV file, one row per line. */
export function MeasurementField({ name, label, columns, example, summary, wide = false, optional = false }: MeasurementFieldProps) {
  const { setFieldValue, setFieldTouched } = useFormikContext<RunFormValues>();
  const load = async (file: File | undefined) => {
    if (!file) return;
    await setFieldValue(name, await file.text());
    await setFieldTouched(name, true, false);
  };
  return (
    <GridItem colSpan={wide ? { base: 1, lg: 2 } : 1}>
      <FormField
        name={name}
        label={label}
        required={!optional}
        helperText={
          <Stack gap="0.5" as="span">
            <span>Columns: {columns}. Paste from a spreadsheet (tabs), or separate with commas or semicolons.</span>
            {summary && (
              <Text as="span" color="fg">
                {summary}
              </Text>
            )}
          </Stack>
        }
      >
        {(field) => (
          <Stack gap="2" width="full">
            <Textarea
              {...field}
              width="full"
              value={(field.value as string) ?? ''}
              rows={7}
              fontFamily="mono"
              fontSize="sm"
              placeholder={example}
              spellCheck={false}
              aria-label={label}
            />
            <HStack>
              <FileUpload.Root
                accept={['.csv', '.txt', '.tsv', 'text/csv', 'text/plain']}
                maxFiles={1}
                onFileAccept={(details) => void load(details.files[0])}
              >
                <FileUpload.HiddenInput aria-label={`${label}: read from a file`} />
                <FileUpload.Trigger asChild>
                  <Button size="xs" variant="outline">
                    Read from a CSV file
                  </Button>
                </FileUpload.Trigger>
              </FileUpload.Root>
            </HStack>
          </Stack>
        )}
      </FormField>
    </GridItem>
  );
}
