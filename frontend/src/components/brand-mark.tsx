import { HStack, Text } from '@chakra-ui/react';
import { useEffect } from 'react';

export interface BrandMarkProps {
  /** Edge of the square mark in pixels. */
  size?: number;
  /** On the dark rail the tile is a faint white; on a light page it takes the brand colour. */
  onRail?: boolean;
  fontSize?: 'lg' | '2xl';
  gap?: string;
}

/** The Meritline mark and name. */
export function BrandMark({ size = 26, onRail = true, fontSize = 'lg', gap = '2.5' }: BrandMarkProps) {
  return (
    <HStack gap={gap}>
      <svg viewBox="0 0 32 32" width={size} height={size} aria-hidden="true">
        <rect width="32" height="32" rx="7" fill={onRail ? 'rgba(255,255,255,0.1)' : 'var(--chakra-colors-spruce-700)'} />
        <path
          d="M7 23V9l9 9 9-9v14"
          fill="none"
          stroke="var(--chakra-colors-amber-400)"
          strokeWidth="3"
          strokeLinecap="round"
          strokeLinejoin="round"
        />
      </svg>
      <Text as="span" fontWeight="700" fontSize={fontSize} letterSpacing="-0.01em">
        Meritline
      </Text>
    </HStack>
  );
}

/** The browser tab names the page first, then the product. */
export function usePageTitle(title: string) {
  useEffect(() => {
    document.title = `${title} · Meritline`;
  }, [title]);
}
