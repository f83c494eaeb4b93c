import { Grid, Heading, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';

/** A data step: its sections on the left and, on a wide screen, the live figures beside them. */
export function DataStepLayout({ children }: { children: ReactNode }) {
  return (
    <Grid templateColumns={{ base: 'minmax(0, 1fr)', xl: 'minmax(0, 3fr) minmax(20rem, 2fr)' }} gap="8" alignItems="start">
      {children}
    </Grid>
  );
}

export interface StepSectionProps {
  title: string;
  /** The step's main section has the larger heading; optional parts follow it smaller. */
  size?: 'lg' | 'md';
  /** What goes in, in words. */
  intro: ReactNode;
  children: ReactNode;
}

export function StepSection({ title, size = 'lg', intro, children }: StepSectionProps) {
  return (
    <Stack gap="3">
      <Heading as="h2" size={size}>
        {title}
      </Heading>
      <Text color="fg.muted">{intro}</Text>
      {children}
    </Stack>
  );
}
