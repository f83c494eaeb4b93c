import { IconButton, type IconButtonProps } from '@chakra-ui/react';
import { ThemeProvider, useTheme, type ThemeProviderProps } from 'next-themes';
import { LineIcon } from '@/components/line-icon';

export function ColorModeProvider(props: ThemeProviderProps) {
  return <ThemeProvider attribute="class" disableTransitionOnChange {...props} />;
}

export type ColorMode = 'light' | 'dark';

export function useColorMode() {
  const { resolvedTheme, setTheme, forcedTheme } = useTheme();
  const colorMode = (forcedTheme ?? resolvedTheme) as ColorMode | undefined;
  const toggleColorMode = () => setTheme(resolvedTheme === 'dark' ? 'light' : 'dark');
  return { colorMode, setColorMode: setTheme, toggleColorMode };
}

function SunIcon() {
  return (
    <LineIcon>
      <circle cx="12" cy="12" r="4" />
      <path d="M12 2v2M12 20v2M4.9 4.9l1.4 1.4M17.7 17.7l1.4 1.4M2 12h2M20 12h2M4.9 19.1l1.4-1.4M17.7 6.3l1.4-1.4" />
    </LineIcon>
  );
}

function MoonIcon() {
  return (
    <LineIcon>
      <path d="M20 14.5A8 8 0 0 1 9.5 4a8 8 0 1 0 10.5 10.5z" />
    </LineIcon>
  );
}

export function ColorModeButton(props: Omit<IconButtonProps, 'aria-label'>) {
  const { colorMode, toggleColorMode } = useColorMode();
  const label = colorMode === 'dark' ? 'Use light colours' : 'Use dark colours';
  return (
    <IconButton variant="ghost" size="sm" aria-label={label} title={label} onClick={toggleColorMode} {...props}>
      {colorMode === 'dark' ? <SunIcon /> : <MoonIcon />}
    </IconButton>
  );
}
