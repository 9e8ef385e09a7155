import { definePreset } from '@primeuix/themes'
import Aura from '@primeuix/themes/aura'

/**
 * Downdip's accent: "spruce", a deep blue-green chosen for the product. Light mode uses the
 * 600 shade for text-on-white contrast (about 6:1); dark mode the 300 shade on slate.
 */
export const spruce = {
  50: '#f0f7f7',
  100: '#d9ecec',
  200: '#b3d8d9',
  300: '#84bdbf',
  400: '#559ea2',
  500: '#358287',
  600: '#28696e',
  700: '#225559',
  800: '#1e464a',
  900: '#1b3b3e',
  950: '#0d2426',
} as const

const slate = {
  0: '#ffffff',
  50: '{slate.50}',
  100: '{slate.100}',
  200: '{slate.200}',
  300: '{slate.300}',
  400: '{slate.400}',
  500: '{slate.500}',
  600: '{slate.600}',
  700: '{slate.700}',
  800: '{slate.800}',
  900: '{slate.900}',
  950: '{slate.950}',
}

export const DowndipPreset = definePreset(Aura, {
  primitive: { spruce },
  semantic: {
    primary: {
      50: '{spruce.50}',
      100: '{spruce.100}',
      200: '{spruce.200}',
      300: '{spruce.300}',
      400: '{spruce.400}',
      500: '{spruce.500}',
      600: '{spruce.600}',
      700: '{spruce.700}',
      800: '{spruce.800}',
      900: '{spruce.900}',
      950: '{spruce.950}',
    },
    colorScheme: {
      light: {
        surface: slate,
        primary: {
          color: '{primary.600}',
          contrastColor: '#ffffff',
          hoverColor: '{primary.700}',
          activeColor: '{primary.800}',
        },
        highlight: {
          background: '{primary.50}',
          focusBackground: '{primary.100}',
          color: '{primary.800}',
          focusColor: '{primary.900}',
        },
      },
      dark: {
        surface: slate,
        primary: {
          color: '{primary.300}',
          contrastColor: '{surface.950}',
          hoverColor: '{primary.200}',
          activeColor: '{primary.100}',
        },
        highlight: {
          background: 'color-mix(in srgb, {primary.300}, transparent 84%)',
          focusBackground: 'color-mix(in srgb, {primary.300}, transparent 76%)',
          color: 'rgba(255,255,255,.87)',
          focusColor: 'rgba(255,255,255,.87)',
        },
      },
    },
  },
})
