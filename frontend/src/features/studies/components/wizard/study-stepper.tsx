import { Box, chakra, Flex, Text } from '@chakra-ui/react';
import { Link } from 'react-router';
import { paths } from '@/lib/config/paths';
import { WIZARD_STEPS } from './wizard-steps';

const StepLink = chakra(Link);

export interface StudyStepperProps {
  studyId: string;
  current: number;
  /** A short state per step, e.g. "12 rows" or "none yet". */
  notes: Record<number, string>;
}

/** The seven steps of a study; any step can be opened at any time, the draft saves itself. */
export function StudyStepper({ studyId, current, notes }: StudyStepperProps) {
  return (
    <Box as="nav" aria-label="Study steps" mb="8">
      <Flex as="ol" gap="1" wrap="wrap" listStyleType="none" borderBottomWidth="1px" borderColor="border">
        {WIZARD_STEPS.map((step) => {
          const active = step.number === current;
          return (
            <li key={step.number}>
              <StepLink
                to={paths.studyEdit.getHref(studyId, step.number)}
                aria-current={active ? 'step' : undefined}
                display="flex"
                gap="2.5"
                alignItems="flex-start"
                px="3"
                py="2.5"
                borderBottomWidth="3px"
                borderColor={active ? 'accent.solid' : 'transparent'}
                mb="-1px"
                textDecoration="none"
                color={active ? 'fg' : 'fg.muted'}
                _hover={{ color: 'fg', bg: 'bg.subtle' }}
                _focusVisible={{ outline: '2px solid', outlineColor: 'colorPalette.focusRing', outlineOffset: '-2px' }}
              >
                <Flex
                  as="span"
                  boxSize="6"
                  flexShrink={0}
                  borderRadius="full"
                  align="center"
                  justify="center"
                  fontSize="xs"
                  fontWeight="700"
                  bg={active ? 'brand.solid' : 'bg.muted'}
                  color={active ? 'brand.contrast' : 'fg.muted'}
                >
                  {step.number}
                </Flex>
                <Box as="span">
                  <Text as="span" display="block" fontSize="sm" fontWeight={active ? '600' : '500'} whiteSpace="nowrap">
                    {step.title}
                  </Text>
                  <Text as="span" display="block" fontSize="xs" color="fg.muted" whiteSpace="nowrap">
                    {notes[step.number] ?? step.summary}
                  </Text>
                </Box>
              </StepLink>
            </li>
          );
        })}
      </Flex>
    </Box>
  );
}
