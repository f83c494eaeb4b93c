import type { ModelChoice, RunModel } from '@meritline/shared';
import { Field, HStack, RadioCard, SimpleGrid, Stack, Switch, Text } from '@chakra-ui/react';
import { SelectControl } from '@/components/select-control';
import { WEIGHTING_LABELS } from '@/components/study-results';

const MODELS: Record<RunModel, { title: string; cost: string }> = {
  'one-point': {
    title: 'One point',
    cost: 'One standard and the origin. Fastest; no interval, and biased wherever the true line misses the origin.',
  },
  'two-point': {
    title: 'Two points',
    cost: 'A line through two standards. No interval and no check that the response is straight between them.',
  },
  linear: {
    title: 'Straight-line regression',
    cost: 'Least squares through at least 3 standards. Each result gets a confidence interval.',
  },
  quadratic: {
    title: 'Quadratic regression',
    cost: 'A curve through at least 4 standards at 3 or more levels, for responses that bend.',
  },
};

export interface ModelPickerProps {
  choices: readonly ModelChoice[];
  value: RunModel | '';
  onChange: (model: RunModel) => void;
  bracketing: boolean;
  onBracketingChange: (bracketing: boolean) => void;
  levels: readonly number[];
  calibrant: string;
  onCalibrantChange: (level: string) => void;
  unit: string;
}

/** The four ways to calibrate a run, each with what it costs; those the validation does not justify are shown disabled with the reason. */
export function ModelPicker({
  choices,
  value,
  onChange,
  bracketing,
  onBracketingChange,
  levels,
  calibrant,
  onCalibrantChange,
  unit,
}: ModelPickerProps) {
  const calibrantValue = levels.map(String).includes(calibrant) ? calibrant : String(levels.at(-1) ?? '');
  return (
    <Stack gap="4">
      <RadioCard.Root
        value={value || null}
        onValueChange={(event) => event.value && onChange(event.value as RunModel)}
        aria-label="Calibration"
      >
        <SimpleGrid columns={{ base: 1, md: 2, xl: 4 }} gap="3">
          {choices.map((choice) => (
            <RadioCard.Item
              key={choice.model}
              value={choice.model}
              disabled={!choice.allowed}
              alignItems="stretch"
              // The reason must stay readable on a card that cannot be chosen.
              _disabled={{ opacity: 1, bg: 'bg.muted', cursor: 'not-allowed', color: 'fg.muted' }}
            >
              <RadioCard.ItemHiddenInput />
              <RadioCard.ItemControl>
                <RadioCard.ItemContent gap="1.5">
                  <RadioCard.ItemText fontWeight="600">{MODELS[choice.model].title}</RadioCard.ItemText>
                  <RadioCard.ItemDescription>{MODELS[choice.model].cost}</RadioCard.ItemDescription>
                  {choice.allowed && choice.weighting && choice.weighting !== 'none' && (
                    <Text fontSize="sm" color="fg.muted">
                      Weighting {WEIGHTING_LABELS[choice.weighting] ?? choice.weighting}, as validated.
                    </Text>
                  )}
                  {!choice.allowed && choice.reason && (
                    <Text fontSize="sm" color="fg.error" data-testid={`model-reason-${choice.model}`}>
                      Not offered: {choice.reason}
                    </Text>
                  )}
                </RadioCard.ItemContent>
                <RadioCard.ItemIndicator />
              </RadioCard.ItemControl>
            </RadioCard.Item>
          ))}
        </SimpleGrid>
      </RadioCard.Root>
      {value === 'two-point' && (
        <Switch.Root checked={bracketing} onCheckedChange={(event) => onBracketingChange(event.checked)}>
          <Switch.HiddenInput />
          <Switch.Control />
          <Switch.Label>
            Read each sample between the two standards that bracket it
            <Text as="span" display="block" fontSize="sm" color="fg.muted" fontWeight="normal">
              Off: one line through the lowest and highest standard; the standards between them are kept but not used.
            </Text>
          </Switch.Label>
        </Switch.Root>
      )}
      {value === 'one-point' && levels.length > 0 && (
        <Field.Root maxW="sm">
          <Field.Label>Calibrate with the standard at</Field.Label>
          <HStack>
            <SelectControl
              value={calibrantValue}
              onChange={onCalibrantChange}
              options={levels.map((level) => ({ value: String(level), label: `${level} ${unit}` }))}
            />
          </HStack>
          <Field.HelperText>The other standards stay in the record, marked as not used.</Field.HelperText>
        </Field.Root>
      )}
    </Stack>
  );
}
