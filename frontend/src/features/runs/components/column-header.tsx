import { Text } from '@chakra-ui/react';

/** A column title with its unit; the unit keeps its case (table headers are upper-cased, and µ would read as M). */
export function headerWithUnit(label: string, unit: string) {
  const Header = () => (
    <>
      {label}{' '}
      <Text as="span" textTransform="none" letterSpacing="normal">
        ({unit})
      </Text>
    </>
  );
  return Header;
}
