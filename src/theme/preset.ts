import { definePreset } from '@primeuix/themes'
import Aura from '@primeuix/themes/aura'

// Fractolog's own palette: a deep slate-teal for actions, warm paper neutrals for surfaces.
export const FractologPreset = definePreset(Aura, {
  semantic: {
    primary: {
      50: '#eef6f7',
      100: '#d4e8ec',
      200: '#a9d0d8',
      300: '#77b1bd',
      400: '#4b8f9e',
      500: '#2f7282',
      600: '#245d6b',
      700: '#1d4f5e',
      800: '#183f4a',
      900: '#12303a',
      950: '#0b1f26',
    },
    colorScheme: {
      light: {
        surface: {
          0: '#ffffff',
          50: '#faf8f4',
          100: '#f3efe7',
          200: '#e6e0d4',
          300: '#d2cabb',
          400: '#aba292',
          // dark enough for muted text and placeholders: 4.8:1 on surface 100, 5.5:1 on white (WCAG AA)
          500: '#706859',
          600: '#655e52',
          700: '#4b463d',
          800: '#34302a',
          900: '#221f1b',
          950: '#15130f',
        },
      },
    },
  },
})
