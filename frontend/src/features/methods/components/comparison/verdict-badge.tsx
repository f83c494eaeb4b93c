import { Badge } from '@chakra-ui/react';
import { comparisonVerdictLabel, type ComparisonVerdict } from '@meritline/shared';

const PALETTE: Record<ComparisonVerdict, string> = {
  'no-difference': 'gray',
  different: 'orange',
  equivalent: 'green',
  inconclusive: 'gray',
};

/** The verdict of a comparison in words (the colour only repeats them). */
export function VerdictBadge({ verdict }: { verdict: ComparisonVerdict }) {
  return (
    <Badge colorPalette={PALETTE[verdict]} size="lg" variant="surface" data-verdict={verdict}>
      {comparisonVerdictLabel(verdict)}
    </Badge>
  );
}
