import '@fontsource/ibm-plex-sans/400.css';
import '@fontsource/ibm-plex-sans/500.css';
import '@fontsource/ibm-plex-sans/600.css';
import '@fontsource/ibm-plex-sans/700.css';
import { createSystem, defaultConfig, defineConfig } from '@chakra-ui/react';

type Scale = Record<'50' | '100' | '200' | '300' | '400' | '500' | '600' | '700' | '800' | '900' | '950', string>;

const toTokens = (scale: Scale) => Object.fromEntries(Object.entries(scale).map(([step, value]) => [step, { value }]));

const spruce: Scale = {
  '50': '#eef6f5',
  '100': '#d5e9e6',
  '200': '#aed4ce',
  '300': '#7fb8b0',
  '400': '#4f978e',
  '500': '#2f7a72',
  '600': '#22635d',
  '700': '#1c4f4b',
  '800': '#173f3c',
  '900': '#123230',
  '950': '#0a1f1e',
};

const amber: Scale = {
  '50': '#fff8eb',
  '100': '#feecc7',
  '200': '#fcd68a',
  '300': '#f9bb4d',
  '400': '#f0a024',
  '500': '#d9830f',
  '600': '#b5650a',
  '700': '#8f4c0d',
  '800': '#733d11',
  '900': '#5f3312',
  '950': '#371a05',
};

// Cool slate neutrals replace the default grays everywhere (borders, muted text, panels).
const slate: Scale = {
  '50': '#f6f8fa',
  '100': '#eceff3',
  '200': '#dde2e8',
  '300': '#c3cbd5',
  '400': '#94a0ae',
  '500': '#687586',
  '600': '#4f5b6b',
  '700': '#3b4553',
  '800': '#272f3a',
  '900': '#181e26',
  '950': '#0e1217',
};

const palette = (name: string, tone: { solid: [string, string]; contrast: [string, string] }) => ({
  solid: { value: { _light: `{colors.${name}.${tone.solid[0]}}`, _dark: `{colors.${name}.${tone.solid[1]}}` } },
  contrast: { value: { _light: tone.contrast[0], _dark: tone.contrast[1] } },
  fg: { value: { _light: `{colors.${name}.700}`, _dark: `{colors.${name}.300}` } },
  subtle: { value: { _light: `{colors.${name}.50}`, _dark: `{colors.${name}.950}` } },
  muted: { value: { _light: `{colors.${name}.100}`, _dark: `{colors.${name}.900}` } },
  emphasized: { value: { _light: `{colors.${name}.200}`, _dark: `{colors.${name}.800}` } },
  focusRing: { value: { _light: `{colors.${name}.500}`, _dark: `{colors.${name}.400}` } },
  border: { value: { _light: `{colors.${name}.200}`, _dark: `{colors.${name}.800}` } },
});

const config = defineConfig({
  globalCss: {
    html: { colorPalette: 'brand' },
    body: { fontFeatureSettings: '"tnum" 1' },
  },
  theme: {
    tokens: {
      colors: {
        spruce: toTokens(spruce),
        amber: toTokens(amber),
        gray: toTokens(slate),
      },
      fonts: {
        heading: { value: "'IBM Plex Sans', system-ui, sans-serif" },
        body: { value: "'IBM Plex Sans', system-ui, sans-serif" },
      },
    },
    semanticTokens: {
      colors: {
        brand: palette('spruce', { solid: ['700', '400'], contrast: ['white', '{colors.spruce.950}'] }),
        accent: palette('amber', { solid: ['400', '400'], contrast: ['{colors.amber.950}', '{colors.amber.950}'] }),
        bg: {
          DEFAULT: { value: { _light: '{colors.white}', _dark: '{colors.gray.950}' } },
          canvas: { value: { _light: '{colors.gray.50}', _dark: '{colors.gray.950}' } },
          panel: { value: { _light: '{colors.white}', _dark: '{colors.gray.900}' } },
          rail: { value: { _light: '{colors.spruce.800}', _dark: '{colors.spruce.950}' } },
        },
        fg: {
          DEFAULT: { value: { _light: '{colors.gray.900}', _dark: '{colors.gray.50}' } },
          rail: { value: { _light: '{colors.spruce.50}', _dark: '{colors.spruce.100}' } },
          railMuted: { value: { _light: '{colors.spruce.200}', _dark: '{colors.spruce.300}' } },
        },
      },
    },
    textStyles: {
      sectionLabel: {
        value: {
          fontSize: '0.7rem',
          fontWeight: '600',
          letterSpacing: '0.12em',
          textTransform: 'uppercase',
          lineHeight: '1.2',
        },
      },
    },
  },
});

export const system = createSystem(defaultConfig, config);
