// Design tokens: the only place colours, spacing, radii and type sizes are defined.
// Palette from the product brief: calm, industrial, legible in sunlight. Never colour alone:
// every state also gets a word and an icon (see StatusPill and Banner).
import type { TextStyle } from 'react-native';

export const colors = {
  ink: '#17212B', // text
  inkSoft: '#45525E', // secondary text (7.4:1 on paper)
  inkFaint: '#5E6B77', // captions, placeholders (5.3:1 on white)
  paper: '#F7F5F0', // app background
  card: '#FFFFFF',
  steel: '#8795A1', // rules and strong borders
  steelLight: '#D3D9DE', // hairlines inside cards, input borders at rest
  steelWash: '#ECEEF0', // pressed rows, selected rail item
  go: '#0F766E', // teal: go, done, approve
  goWash: '#E3F1EF',
  due: '#B45309', // amber: returned, due, needs attention
  dueWash: '#FBF0E4',
  irreversible: '#C2410C', // molten orange-red: ONLY for "cannot be undone"
  irreversibleWash: '#FCEBE3',
  info: '#17212B',
  infoWash: '#E9EDF1',
  onColour: '#FFFFFF', // text on go / irreversible / ink fills
  focus: '#0F766E',
} as const;
export type ColourName = keyof typeof colors;

/** 4-point spacing scale. */
export const space = { xxs: 2, xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32, xxxl: 48 } as const;

export const radii = { sm: 4, md: 6, lg: 10, pill: 999 } as const;

/** Minimum touch target (px) for anything pressable. */
export const touch = 44;

export const layout = {
  /** Side rail and list + detail from this width up. */
  wide: 1024,
  /** Readable column width for forms and detail screens. */
  contentMax: 880,
  formMax: 440,
  railWidth: 232,
} as const;

/** Font families as registered with expo-font (see fonts.ts). */
export const fonts = {
  sans: 'IBMPlexSans_400Regular',
  sansMedium: 'IBMPlexSans_500Medium',
  sansSemiBold: 'IBMPlexSans_600SemiBold',
  mono: 'IBMPlexMono_400Regular',
  monoSemiBold: 'IBMPlexMono_600SemiBold',
} as const;

/** Type scale. IBM Plex Sans for words, IBM Plex Mono for codes and figures. */
export const type = {
  display: { fontFamily: fonts.sansSemiBold, fontSize: 28, lineHeight: 34, color: colors.ink },
  title: { fontFamily: fonts.sansSemiBold, fontSize: 22, lineHeight: 28, color: colors.ink },
  heading: { fontFamily: fonts.sansSemiBold, fontSize: 17, lineHeight: 24, color: colors.ink },
  body: { fontFamily: fonts.sans, fontSize: 16, lineHeight: 24, color: colors.ink },
  bodyStrong: { fontFamily: fonts.sansMedium, fontSize: 16, lineHeight: 24, color: colors.ink },
  label: { fontFamily: fonts.sansMedium, fontSize: 14, lineHeight: 20, color: colors.ink },
  small: { fontFamily: fonts.sans, fontSize: 14, lineHeight: 20, color: colors.inkSoft },
  caption: { fontFamily: fonts.sansMedium, fontSize: 12, lineHeight: 16, letterSpacing: 0.6, textTransform: 'uppercase', color: colors.inkFaint },
  mono: { fontFamily: fonts.mono, fontSize: 15, lineHeight: 22, color: colors.ink },
  monoStrong: { fontFamily: fonts.monoSemiBold, fontSize: 15, lineHeight: 22, color: colors.ink },
  monoSmall: { fontFamily: fonts.mono, fontSize: 13, lineHeight: 18, color: colors.inkSoft },
} satisfies Record<string, TextStyle>;
export type TypeVariant = keyof typeof type;

/** The tones a state can take; each maps to a colour pair. Words and icons come from the caller. */
export const tones = {
  neutral: { fg: colors.inkSoft, bg: colors.steelWash, border: colors.steelLight },
  info: { fg: colors.info, bg: colors.infoWash, border: colors.steel },
  go: { fg: colors.go, bg: colors.goWash, border: colors.go },
  due: { fg: colors.due, bg: colors.dueWash, border: colors.due },
  irreversible: { fg: colors.irreversible, bg: colors.irreversibleWash, border: colors.irreversible },
} as const;
export type Tone = keyof typeof tones;
