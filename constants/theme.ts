/**
 * Tallyrun's design tokens: spacing, type, colour, breakpoints.
 *
 * Colour follows the spirit of ISA-101 (high-performance HMI): everything normal is drawn in
 * neutral greys with high-contrast text; colour is kept for abnormal and alarm states only, and
 * is always paired with a text label and a shape (see `alarmShape`), so a reader who cannot
 * tell the colours apart loses nothing. Interactive elements are told apart by shape, weight and
 * an outline, never by a brand hue. The values are Tallyrun's own.
 */

/** Spacing scale in density-independent pixels (a 4 px grid). */
export const space = {
  xxs: 2,
  xs: 4,
  sm: 8,
  md: 12,
  lg: 16,
  xl: 24,
  xxl: 32,
  xxxl: 48,
} as const;

/** Corner radii: small, so panels read as instruments rather than cards in a feed. */
export const radius = {
  sm: 4,
  md: 6,
  lg: 10,
} as const;

/**
 * Inter is loaded one weight at a time (see app/_layout.tsx); each weight is its own family
 * name, so text picks a weight by family, not by `fontWeight`.
 */
export const fontFamily = {
  regular: 'Inter_400Regular',
  medium: 'Inter_500Medium',
  semibold: 'Inter_600SemiBold',
  bold: 'Inter_700Bold',
} as const;

/** Type scale: font size and line height in px, with the weight each step uses. */
export const type = {
  caption: { fontFamily: fontFamily.regular, fontSize: 12, lineHeight: 16 },
  label: { fontFamily: fontFamily.medium, fontSize: 13, lineHeight: 18 },
  body: { fontFamily: fontFamily.regular, fontSize: 15, lineHeight: 22 },
  bodyStrong: { fontFamily: fontFamily.semibold, fontSize: 15, lineHeight: 22 },
  title: { fontFamily: fontFamily.semibold, fontSize: 18, lineHeight: 24 },
  heading: { fontFamily: fontFamily.semibold, fontSize: 22, lineHeight: 28 },
  display: { fontFamily: fontFamily.bold, fontSize: 28, lineHeight: 34 },
} as const;

export type TypeStep = keyof typeof type;

/** Neutral greys: the whole normal-state display is drawn from these. */
const grey = {
  0: '#FFFFFF',
  50: '#F4F5F6',
  100: '#E9EBED',
  150: '#DFE2E5',
  200: '#D2D6DA',
  300: '#B6BCC2',
  400: '#8E959C',
  500: '#6B727A',
  600: '#4F565D',
  700: '#3A4046',
  800: '#272C31',
  900: '#16191C',
} as const;

export const colors = {
  /** App background: a mid-light grey, so white is free to mean "input here". */
  background: grey[100],
  surface: grey[50],
  surfaceRaised: grey[0],
  surfaceSunken: grey[150],
  border: grey[300],
  borderStrong: grey[500],
  divider: grey[200],

  /** Text: contrast ratios against `surface` stay above 7:1 (WCAG AAA) for body text. */
  text: grey[900],
  textMuted: grey[600],
  textOnDark: grey[0],
  textDisabled: grey[400],

  /** Navigation chrome. */
  navBackground: grey[800],
  navText: grey[100],
  navTextMuted: grey[300],
  navSelected: grey[700],
  navSelectedMarker: grey[0],

  /** Controls: dark neutral fill for the main action, outline for the rest. */
  actionFill: grey[800],
  actionFillPressed: grey[900],
  actionText: grey[0],
  focusRing: grey[900],
  inputBackground: grey[0],

  /**
   * A failed action or a state of the display itself (a rejected form, a lost connection, a figure
   * outside its tolerance): its own colour, always with the ⊗ mark and words, so that red and the
   * priority shapes keep meaning one thing — an alarm's priority (ISA-101). Contrast on its surface ≈ 8:1.
   */
  error: '#6B2D8F',
  errorSurface: '#F1E8F6',

  /** Alarm priorities only (see alarmStyle), always with text and the priority's shape. */
  alarmHigh: '#B0261B',
  alarmHighSurface: '#F7E3E0',
  alarmMedium: '#A65300',
  alarmMediumSurface: '#F8EAD9',
  alarmLow: '#7A6500',
  alarmLowSurface: '#F3EDD0',
} as const;

/** Alarm priorities (ISA-18.2) with the colour, tint and shape that always travel together. */
export const alarmStyle = {
  high: { color: colors.alarmHigh, surface: colors.alarmHighSurface, shape: '▲', label: 'High' },
  medium: { color: colors.alarmMedium, surface: colors.alarmMediumSurface, shape: '◆', label: 'Medium' },
  low: { color: colors.alarmLow, surface: colors.alarmLowSurface, shape: '■', label: 'Low' },
} as const;

/**
 * Named breakpoints (minimum window width in px). Phone-first: a 390 px phone is the design
 * width; `wide` is where the left side navigation appears.
 */
export const breakpoints = {
  phone: 0,
  tablet: 768,
  wide: 1024,
} as const;

export type Breakpoint = keyof typeof breakpoints;

/** Widths of fixed chrome. */
export const layout = {
  sideNavWidth: 248,
  contentMaxWidth: 1120,
  formMaxWidth: 420,
  headerHeight: 56,
  bottomBarHeight: 60,
  /** Smallest comfortable touch target (WCAG 2.5.5 asks for 44 px). */
  touchTarget: 44,
} as const;
